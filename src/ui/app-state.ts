import { reproduction, validateRecord, RECORD_FORMAT, TOOL_NAME, TOOL_VERSION, type AuditRecord } from '../core/audit/record.js';
import type { AuditChoices } from '../core/audit/choices.js';

/**
 * The page state that links, saved state and imported JSON carry: an audit record. Every way in
 * (link, saved state, imported file) and the way out to storage pass the core's one schema,
 * validateRecord (choice-schema.ts), the same code the CLI's --record uses.
 */
export function makeRecord(csv: string, choices: AuditChoices): AuditRecord {
  return { tool: TOOL_NAME, version: TOOL_VERSION, format: RECORD_FORMAT, sample_csv: csv, choices };
}

function toBase64Url(text: string): string {
  const bytes = new TextEncoder().encode(text);
  let bin = '';
  for (let i = 0; i < bytes.length; i += 0x8000) bin += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(bin).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

function fromBase64Url(s: string): string {
  if (!/^[A-Za-z0-9_-]*$/.test(s)) throw new RangeError('the link contains characters that are not base64url');
  const bin = atob(s.replace(/-/g, '+').replace(/_/g, '/') + '==='.slice((s.length + 3) % 4));
  return new TextDecoder('utf-8', { fatal: true }).decode(Uint8Array.from(bin, (c) => c.charCodeAt(0)));
}

/** URL fragment holding the whole state: #state=<base64url(JSON record)>. */
export function encodeShare(rec: AuditRecord): string {
  return `#state=${toBase64Url(JSON.stringify(rec))}`;
}

/** Reads a fragment; throws a RangeError whose message says what is wrong with the link. */
export function decodeShare(hash: string): AuditRecord {
  const m = /^#state=(.*)$/.exec(hash);
  if (!m) throw new RangeError('the link has no "#state=" part');
  let text: string;
  try {
    text = fromBase64Url(m[1]);
  } catch (e) {
    throw new RangeError(`the link is damaged (${(e as Error).message})`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new RangeError('the link is damaged or truncated (its state is not valid JSON)');
  }
  return validateRecord(json);
}

/**
 * '' for a record whose numbers this version reproduces exactly; otherwise a sentence for the page's
 * notice (leading space): the record opens, its numbers are this version's, and why they can differ.
 */
export function notExactNote(rec: AuditRecord): string {
  const r = reproduction(rec);
  return r.exact ? '' : ` It was made by ${TOOL_NAME} ${rec.version} ${r.others}: its numbers are now those of ${TOOL_VERSION} and can differ from the old ones by about their Monte Carlo errors (${r.changed}).`;
}

/** A record from an exported JSON file: the full audit output (with .record) or a bare record (the core's schema). */
export function recordFromJson(text: string): AuditRecord {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new RangeError(`not valid JSON (${(e as Error).message})`);
  }
  return validateRecord(json);
}

export const STORAGE_KEY = 'baryon-audit:state';
export const STORAGE_BACKUP_KEY = 'baryon-audit:unreadable-state';

/** The saved state, or why it could not be used (the unreadable text is kept under a backup key). */
export function loadSaved(storage: Storage): { record?: AuditRecord; problem?: string } {
  const text = storage.getItem(STORAGE_KEY);
  if (text === null) return {};
  try {
    return { record: recordFromJson(text) };
  } catch (e) {
    storage.setItem(STORAGE_BACKUP_KEY, text);
    storage.removeItem(STORAGE_KEY);
    return { problem: `the saved state could not be read (${(e as Error).message}); it was kept under "${STORAGE_BACKUP_KEY}" and the demo was loaded` };
  }
}

/** Saves the state if it passes the record schema (returns false, saving nothing, if it does not). */
export function save(storage: Storage, rec: AuditRecord): boolean {
  try {
    validateRecord(rec);
  } catch {
    return false;
  }
  try {
    storage.setItem(STORAGE_KEY, JSON.stringify(rec));
    return true;
  } catch {
    /* storage full or disabled: the page still works, nothing to save to */
    return false;
  }
}
