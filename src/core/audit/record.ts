import { checkChoices } from './choice-schema.js';
import type { AuditChoices } from './choices.js';

export const TOOL_NAME = 'baryon-audit';
export const TOOL_VERSION = '0.2.0';
export const RECORD_FORMAT = 1;

/**
 * Earlier versions whose records this version reads, each with the records it still reproduces exactly
 * and what changed for the others. 0.2.0 changed the adaptive draw rule only (draw-rule.ts); fixed-draw
 * numbers are byte-identical (test/bench/golden.mjs).
 */
interface EarlierVersion {
  /** Whether a record of that version with these choices gives the same numbers here. */
  readonly reproduces: (c: { readonly fixedDraws?: boolean }) => boolean;
  /** The records it does not reproduce, as words after "a record of <version>" (`with adaptive draws`). */
  readonly others: string;
  /** What changed for them. */
  readonly changed: string;
}
const EARLIER_VERSIONS: Readonly<Record<string, EarlierVersion>> = {
  '0.1.0': {
    reproduces: (c) => c.fixedDraws === true,
    others: 'with adaptive draws',
    changed:
      'its adaptive draw rule looked first at 2000 draws, then every 1000, with the error estimate itself; this version looks at 1000, then every 250, with the error at its upper confidence limit, so a galaxy can stop at another number of draws; its fixed-draw records reproduce exactly',
  },
};
/** Tool versions whose records this version reads (exactly reproduced or not: reproduction). */
export const READABLE_VERSIONS: readonly string[] = [TOOL_VERSION, ...Object.keys(EARLIER_VERSIONS)];

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
    throw new RangeError(`record.version: this is ${TOOL_NAME} ${TOOL_VERSION}, which reads records of version ${READABLE_VERSIONS.join(', ')} (got ${JSON.stringify(r.version) ?? 'nothing'})`);
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

/**
 * Whether this version reproduces a (validated) record's numbers exactly; where it does not, why (a
 * sentence that starts with `record.version`), which records of its version (`others`) and what changed.
 * The CLI refuses such a record; the page opens it (its sample and choices are valid here) and says that
 * its numbers are this version's.
 */
export function reproduction(rec: AuditRecord): { readonly exact: true } | { readonly exact: false; readonly reason: string; readonly others: string; readonly changed: string } {
  const earlier = rec.version === TOOL_VERSION ? undefined : EARLIER_VERSIONS[rec.version];
  if (!earlier || earlier.reproduces(rec.choices)) return { exact: true };
  return { exact: false, reason: `record.version: a record of ${TOOL_NAME} ${rec.version} ${earlier.others} is not reproduced exactly by ${TOOL_VERSION}: ${earlier.changed}`, others: earlier.others, changed: earlier.changed };
}
