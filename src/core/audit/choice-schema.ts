import { GROWTH_MODELS } from '../cosmology/growth.js';
import { covarianceProblems } from '../cosmology/parameter-covariance.js';
import { PARAM_SPECS } from '../cosmology/params.js';
import { validateCosmology } from '../cosmology/validate.js';
import { MASS_FUNCTION_NAMES } from '../halos/models.js';
import { TRANSFER_NAMES } from '../power/transfer.js';
import { parseSfh } from '../stars/sfh.js';
import { CHOICE_SPECS, CHOICE_SWITCHES, DELTA_C_SPEC, DRAW_RULE_SPECS, SURVEY_SPECS, Z_BIN_SPEC, specProblem, type ChoiceSpec } from './choice-specs.js';
import { imfProblem } from './imf-check.js';

/**
 * The one schema of an audit's choices. The CLI's choices, a record given to `assess --record`,
 * the page's share link, its saved state and an imported JSON file all pass through `checkChoices`.
 * Every problem names the field (a dotted path such as `survey.areaArcmin2`) and what is allowed.
 */
export interface ChoiceProblem {
  /** Dotted path inside the choices, e.g. `epsRef`, `surveys[1].zMax`, `transfer.kind`. */
  readonly field: string;
  /** Why, without the field's name. */
  readonly reason: string;
}

/** The most surveys, redshift bins, IMFs and P(k) rows a record may hold (a record is user input). */
export const SCHEMA_LIMITS = { surveys: 1000, zBins: 100, imfs: 50, pkRows: 100000, text: 10000 } as const;

const isObject = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);
const show = (v: unknown): string => (v === undefined ? 'nothing' : typeof v === 'string' ? JSON.stringify(v.length > 60 ? v.slice(0, 60) + '…' : v) : Array.isArray(v) ? 'a list' : isObject(v) ? 'an object' : String(v));

function num(out: ChoiceProblem[], field: string, spec: ChoiceSpec, v: unknown): void {
  const p = specProblem(spec, v);
  if (p) out.push({ field, reason: p });
}

function text(out: ChoiceProblem[], field: string, v: unknown): v is string {
  if (typeof v !== 'string' || v.trim() === '') {
    out.push({ field, reason: `must be non-empty text (got ${show(v)})` });
    return false;
  }
  if (v.length > SCHEMA_LIMITS.text) {
    out.push({ field, reason: `is longer than ${SCHEMA_LIMITS.text} characters` });
    return false;
  }
  return true;
}

/** A survey object: non-empty name, area and 0 ≤ z_min < z_max ≤ 30 from SURVEY_SPECS. */
export function checkSurvey(s: unknown, field: string): ChoiceProblem[] {
  const out: ChoiceProblem[] = [];
  if (!isObject(s)) return [{ field, reason: `must be a survey {name, areaArcmin2, zMin, zMax} (got ${show(s)})` }];
  text(out, `${field}.name`, s.name);
  for (const spec of SURVEY_SPECS) num(out, `${field}.${spec.key}`, spec, s[spec.key]);
  if (!out.length && !((s.zMax as number) > (s.zMin as number))) out.push({ field: `${field}.zMax`, reason: `must exceed zMin = ${String(s.zMin)} (got ${String(s.zMax)})` });
  return out;
}

function checkTransfer(t: unknown): ChoiceProblem[] {
  const kinds = [...TRANSFER_NAMES, 'table'];
  if (!isObject(t)) return [{ field: 'transfer', reason: `must be {kind: ${kinds.join(' | ')}} (got ${show(t)})` }];
  if (typeof t.kind !== 'string' || !kinds.includes(t.kind)) return [{ field: 'transfer.kind', reason: `must be one of ${kinds.join(', ')} (got ${show(t.kind)})` }];
  if (t.kind !== 'table') return [];
  const k = t.kMpc;
  const p = t.pMpc3;
  for (const [name, arr] of [['kMpc', k], ['pMpc3', p]] as const) {
    if (!Array.isArray(arr)) return [{ field: `transfer.${name}`, reason: `a table transfer needs the list ${name} (got ${show(arr)})` }];
    if (arr.length < 4 || arr.length > SCHEMA_LIMITS.pkRows) return [{ field: `transfer.${name}`, reason: `needs 4 to ${SCHEMA_LIMITS.pkRows} values (got ${arr.length})` }];
    const bad = arr.findIndex((x) => typeof x !== 'number' || !Number.isFinite(x) || x <= 0);
    if (bad >= 0) return [{ field: `transfer.${name}[${bad}]`, reason: `must be a finite number > 0 (got ${show(arr[bad])})` }];
  }
  const ka = k as number[];
  if (ka.length !== (p as number[]).length) return [{ field: 'transfer.pMpc3', reason: `must have as many values as kMpc (${ka.length}; got ${(p as number[]).length})` }];
  const nonInc = ka.findIndex((x, i) => i > 0 && !(x > ka[i - 1]));
  if (nonInc >= 0) return [{ field: `transfer.kMpc[${nonInc}]`, reason: 'k must increase strictly' }];
  return [];
}

function checkDeltaC(d: unknown): ChoiceProblem[] {
  if (!isObject(d)) return [{ field: 'deltaC', reason: `must be {kind: "constant", value} or {kind: "omega-m"} (got ${show(d)})` }];
  if (d.kind === 'omega-m') return [];
  if (d.kind !== 'constant') return [{ field: 'deltaC.kind', reason: `must be "constant" or "omega-m" (got ${show(d.kind)})` }];
  const out: ChoiceProblem[] = [];
  num(out, 'deltaC.value', DELTA_C_SPEC, d.value);
  return out;
}

function checkCosmology(c: unknown): ChoiceProblem[] {
  if (!isObject(c)) return [{ field: 'cosmology', reason: `must be an object of cosmological parameters (got ${show(c)})` }];
  const out: ChoiceProblem[] = [];
  for (const s of PARAM_SPECS) {
    const v = c[s.key];
    if (typeof v !== 'number' || !Number.isFinite(v) || v < s.min || v > s.max) out.push({ field: `cosmology.${s.key}`, reason: `${s.doc} must be a number in [${s.min}, ${s.max}]${s.unit ? ' ' + s.unit : ''} (got ${show(v)})` });
  }
  if (out.length) return out;
  // Physical conditions (Ωb ≤ Ωm, a hot big bang): the cosmology's own checks.
  return validateCosmology(c as never).map((p) => ({ field: p.field === 'expansion' ? 'cosmology' : `cosmology.${p.field}`, reason: p.message.replace(/^--[\w-]+: /, '') }));
}

function checkZBins(b: unknown): ChoiceProblem[] {
  if (!Array.isArray(b)) return [{ field: 'zBins', reason: `must be a list of [z_min, z_max] pairs (got ${show(b)})` }];
  if (b.length > SCHEMA_LIMITS.zBins) return [{ field: 'zBins', reason: `holds at most ${SCHEMA_LIMITS.zBins} bins (got ${b.length})` }];
  const out: ChoiceProblem[] = [];
  b.forEach((pair, i) => {
    const ok = Array.isArray(pair) && pair.length === 2 && pair.every((x) => typeof x === 'number' && Number.isFinite(x));
    if (!ok || !(pair[0] >= Z_BIN_SPEC.min && pair[1] > pair[0] && pair[1] <= Z_BIN_SPEC.max)) {
      out.push({ field: `zBins[${i}]`, reason: `must be a pair [a, b] with ${Z_BIN_SPEC.min} ≤ a < b ≤ ${Z_BIN_SPEC.max} (got ${Array.isArray(pair) ? JSON.stringify(pair) : show(pair)})` });
    }
  });
  return out;
}

function checkCovariance(c: unknown): ChoiceProblem[] {
  if (!isObject(c) || !Array.isArray(c.matrix) || !c.matrix.every((r) => Array.isArray(r))) return [{ field: 'cosmologyCovariance', reason: `must be {matrix: 5×5 numbers, source} (got ${show(c)})` }];
  const out: ChoiceProblem[] = [];
  text(out, 'cosmologyCovariance.source', c.source);
  for (const p of covarianceProblems(c.matrix as number[][])) out.push({ field: p.row ? `cosmologyCovariance.matrix[${p.row}][${p.column}]` : 'cosmologyCovariance.matrix', reason: p.message });
  return out;
}

/**
 * Every problem with a choices object (any JSON value). An empty list means `x` is a valid
 * AuditChoices. `headlineImf` may be missing (it defaults to the first of `imfs`), and so may the
 * switches of CHOICE_SWITCHES and the numbers of DRAW_RULE_SPECS (their defaults).
 */
export function checkChoices(x: unknown): ChoiceProblem[] {
  if (!isObject(x)) return [{ field: '(choices)', reason: `must be an object (got ${show(x)})` }];
  const out: ChoiceProblem[] = [];
  for (const spec of CHOICE_SPECS) num(out, spec.key, spec, x[spec.key]);
  for (const spec of DRAW_RULE_SPECS) if (x[spec.key] !== undefined) num(out, spec.key, spec, x[spec.key]);
  for (const spec of CHOICE_SWITCHES) {
    const v = x[spec.key];
    if (v !== undefined && typeof v !== 'boolean') out.push({ field: spec.key, reason: `must be true or false (got ${show(v)})` });
  }
  out.push(...checkCosmology(x.cosmology));
  if (typeof x.massFunction !== 'string' || !MASS_FUNCTION_NAMES.includes(x.massFunction)) out.push({ field: 'massFunction', reason: `must be one of ${MASS_FUNCTION_NAMES.join(', ')} (got ${show(x.massFunction)})` });
  out.push(...checkTransfer(x.transfer), ...checkDeltaC(x.deltaC));
  if (!Array.isArray(x.imfs) || x.imfs.length === 0 || x.imfs.length > SCHEMA_LIMITS.imfs) {
    out.push({ field: 'imfs', reason: `must be a list of 1 to ${SCHEMA_LIMITS.imfs} IMF names (got ${Array.isArray(x.imfs) ? `${x.imfs.length} items` : show(x.imfs)})` });
  } else {
    x.imfs.forEach((n, i) => {
      const p = typeof n === 'string' ? imfProblem(n) : `must be an IMF name (got ${show(n)})`;
      if (p) out.push({ field: `imfs[${i}]`, reason: p });
    });
    const dup = x.imfs.find((n, i) => x.imfs && (x.imfs as unknown[]).indexOf(n) !== i);
    if (dup !== undefined) out.push({ field: 'imfs', reason: `lists ${show(dup)} twice` });
  }
  if (x.headlineImf !== undefined) {
    const p = typeof x.headlineImf === 'string' ? imfProblem(x.headlineImf) : `must be an IMF name (got ${show(x.headlineImf)})`;
    if (p) out.push({ field: 'headlineImf', reason: p });
  }
  if (x.growth !== undefined && !(GROWTH_MODELS as readonly unknown[]).includes(x.growth)) out.push({ field: 'growth', reason: `must be one of ${GROWTH_MODELS.join(', ')} (got ${show(x.growth)})` });
  if (x.cosmologyCovariance !== undefined) out.push(...checkCovariance(x.cosmologyCovariance));
  if (text(out, 'sfh', x.sfh)) {
    try {
      parseSfh(x.sfh);
    } catch (e) {
      out.push({ field: 'sfh', reason: (e as Error).message });
    }
  }
  out.push(...checkSurvey(x.survey, 'survey'));
  if (!Array.isArray(x.surveys) || x.surveys.length > SCHEMA_LIMITS.surveys) {
    out.push({ field: 'surveys', reason: `must be a list of at most ${SCHEMA_LIMITS.surveys} surveys (got ${Array.isArray(x.surveys) ? `${x.surveys.length} items` : show(x.surveys)})` });
  } else {
    const names = new Set<string>();
    x.surveys.forEach((s, i) => {
      const p = checkSurvey(s, `surveys[${i}]`);
      out.push(...p);
      if (!p.length) {
        const name = (s as { name: string }).name;
        if (names.has(name)) out.push({ field: `surveys[${i}].name`, reason: `"${name}" repeats` });
        names.add(name);
      }
    });
  }
  out.push(...checkZBins(x.zBins));
  return out;
}

/** "field: reason" lines, for messages. */
export function problemText(p: readonly ChoiceProblem[], prefix = ''): string[] {
  return p.map((q) => `${prefix}${q.field}: ${q.reason}`);
}
