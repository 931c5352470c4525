import type { CosmologyParams } from '../cosmology/params.js';
import { validateCosmology } from '../cosmology/validate.js';
import { validateChoices, type AuditChoices } from './choices.js';

export const TOOL_NAME = 'baryon-audit';
export const TOOL_VERSION = '0.1.0';
export const RECORD_FORMAT = 1;

/** Everything needed to reproduce an audit exactly: the sample as given and every choice. */
export interface AuditRecord {
  readonly tool: typeof TOOL_NAME;
  readonly version: string;
  readonly format: number;
  readonly sample_csv: string;
  readonly choices: AuditChoices;
}

/** Checks a record read back from JSON before re-running it; messages name the field. */
export function validateRecord(x: unknown): AuditRecord {
  const r = x as Partial<AuditRecord> | null;
  if (!r || typeof r !== 'object') throw new RangeError('record: not a JSON object');
  if (r.tool !== TOOL_NAME) throw new RangeError(`record.tool: expected "${TOOL_NAME}" (got ${JSON.stringify(r.tool)})`);
  if (r.format !== RECORD_FORMAT) throw new RangeError(`record.format: this version reads format ${RECORD_FORMAT} (got ${JSON.stringify(r.format)})`);
  if (typeof r.sample_csv !== 'string') throw new RangeError('record.sample_csv: missing or not text');
  const c = r.choices as Partial<AuditChoices> | undefined;
  if (!c || typeof c !== 'object') throw new RangeError('record.choices: missing');
  for (const k of ['massFunction', 'sfh'] as const) if (typeof c[k] !== 'string') throw new RangeError(`record.choices.${k}: missing or not text`);
  for (const k of ['metallicity', 'epsRef', 'quantile', 'draws', 'seed', 'sliceDz', 'formationZ'] as const) {
    if (typeof c[k] !== 'number' || !Number.isFinite(c[k])) throw new RangeError(`record.choices.${k}: missing or not a finite number`);
  }
  if (!Array.isArray(c.imfs) || !c.imfs.every((s) => typeof s === 'string')) throw new RangeError('record.choices.imfs: not a list of IMF names');
  if (!c.cosmology || typeof c.cosmology !== 'object') throw new RangeError('record.choices.cosmology: missing');
  if (!c.transfer || typeof c.transfer !== 'object') throw new RangeError('record.choices.transfer: missing');
  if (!c.deltaC || typeof c.deltaC !== 'object') throw new RangeError('record.choices.deltaC: missing');
  if (!c.survey || typeof c.survey !== 'object') throw new RangeError('record.choices.survey: missing');
  if (!Array.isArray(c.surveys) || !Array.isArray(c.zBins)) throw new RangeError('record.choices.surveys / zBins: not lists');
  const cp = validateCosmology(c.cosmology as CosmologyParams);
  if (cp.length) throw new RangeError(`record.choices.cosmology: ${cp.map((p) => p.message).join('; ')}`);
  const cc = validateChoices(c as AuditChoices);
  if (cc.length) throw new RangeError(`record.choices: ${cc.join('; ')}`);
  return r as AuditRecord;
}
