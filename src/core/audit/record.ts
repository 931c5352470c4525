import { checkChoices } from './choice-schema.js';
import type { AuditChoices } from './choices.js';

export const TOOL_NAME = 'baryon-audit';
export const TOOL_VERSION = '0.1.0';
export const RECORD_FORMAT = 1;
/** Tool versions whose records this version reproduces exactly. */
export const READABLE_VERSIONS: readonly string[] = [TOOL_VERSION];

/** Everything needed to reproduce an audit exactly: the sample as given and every choice. */
export interface AuditRecord {
  readonly tool: typeof TOOL_NAME;
  readonly version: string;
  readonly format: number;
  readonly sample_csv: string;
  readonly choices: AuditChoices;
}

const RECORD_KEYS = ['tool', 'version', 'format', 'sample_csv', 'choices'];
const CHOICE_KEYS = ['cosmology', 'massFunction', 'transfer', 'deltaC', 'growth', 'cosmologyCovariance', 'imfs', 'headlineImf', 'sfh', 'metallicity', 'epsRef', 'quantile', 'draws', 'fixedDraws', 'drawPrecisionDex', 'seed', 'sliceDz', 'formationZ', 'survey', 'surveys', 'zBins'];

const isObject = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);

/**
 * The record inside a JSON value: a bare record, or the tool's whole audit output (the CLI's
 * `--format json` and the page's "Full JSON record"), which carries it under `record`.
 */
export function recordIn(x: unknown): unknown {
  return isObject(x) && !('tool' in x) && isObject(x.record) ? x.record : x;
}

/**
 * Checks a record (or a whole audit output holding one) read back from JSON before re-running it,
 * with the one choice schema (choice-schema.ts). Messages start with `record.` and name the field.
 */
export function validateRecord(x: unknown): AuditRecord {
  const r = recordIn(x);
  if (!isObject(r)) throw new RangeError('record: not a JSON object (expected a record or the JSON output of an audit)');
  if (r.tool !== TOOL_NAME) throw new RangeError(`record.tool: expected "${TOOL_NAME}" (got ${JSON.stringify(r.tool) ?? 'nothing'})`);
  if (r.format !== RECORD_FORMAT) throw new RangeError(`record.format: this version reads format ${RECORD_FORMAT} (got ${JSON.stringify(r.format) ?? 'nothing'})`);
  if (typeof r.version !== 'string' || !READABLE_VERSIONS.includes(r.version)) {
    throw new RangeError(`record.version: this is ${TOOL_NAME} ${TOOL_VERSION}, which reproduces records of version ${READABLE_VERSIONS.join(', ')} (got ${JSON.stringify(r.version) ?? 'nothing'})`);
  }
  const extra = Object.keys(r).find((k) => !RECORD_KEYS.includes(k));
  if (extra !== undefined) throw new RangeError(`record.${extra}: not a field of a record (fields: ${RECORD_KEYS.join(', ')})`);
  if (typeof r.sample_csv !== 'string') throw new RangeError('record.sample_csv: missing or not text');
  if (!isObject(r.choices)) throw new RangeError('record.choices: missing or not an object');
  const extraChoice = Object.keys(r.choices).find((k) => !CHOICE_KEYS.includes(k));
  if (extraChoice !== undefined) throw new RangeError(`record.choices.${extraChoice}: not a choice (choices: ${CHOICE_KEYS.join(', ')})`);
  const problems = checkChoices(r.choices);
  if (problems.length) throw new RangeError(problems.map((p) => `record.choices.${p.field}: ${p.reason}`).join('; '));
  return r as unknown as AuditRecord;
}
