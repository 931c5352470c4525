import { makeHaloModel } from '../halos/halo-model.js';
import { makePopulationCache } from '../stars/population-cache.js';
import { IMF_NAMES, resolveImf } from '../stars/imf-presets.js';
import { parseSfh } from '../stars/sfh.js';
import { makeCeilingTable, type CeilingTable } from './ceiling.js';
import { validateChoices, type AuditChoices } from './choices.js';
import { boxSigmaDm } from './cosmic-variance.js';
import { auditGalaxy, type AuditContext, type GalaxyAudit } from './galaxy-audit.js';
import { parseSample, type RowProblem } from './sample.js';
import { binBudget, type BinBudget, type BudgetMember } from './sample-budget.js';
import { validateSurvey, type Survey } from './survey.js';
import type { Verdict } from './verdict.js';

export const TOOL_NAME = 'baryon-audit';
export const TOOL_VERSION = '0.1.0';
export const RECORD_FORMAT = 1;

export const AUDIT_CAUTION =
  'These results depend on the assumed stellar population (IMF, star-formation history, dust), on the redshift solutions and on the cosmology and halo mass function; the audit complements, not replaces, full spectral fitting and spectroscopic confirmation.';

/** Everything needed to reproduce an audit exactly: the sample as given and every choice. */
export interface AuditRecord {
  readonly tool: typeof TOOL_NAME;
  readonly version: string;
  readonly format: number;
  readonly sample_csv: string;
  readonly choices: AuditChoices;
}

export interface GalaxyRow extends Partial<GalaxyAudit> {
  readonly row: number;
  readonly id: string;
  readonly status: 'ok' | 'rejected';
  readonly errors: RowProblem[];
  readonly survey: string;
  readonly input: Readonly<Record<string, string>>;
  readonly verdict?: Verdict;
}

export interface AuditResult {
  readonly galaxies: GalaxyRow[];
  readonly sample: { readonly bins: BinBudget[]; readonly accepted: number; readonly rejected: number; readonly extra_columns: readonly string[]; readonly file_errors: readonly string[] };
  readonly caution: string;
  readonly record: AuditRecord;
}

export interface AuditHooks {
  onProgress?(done: number, total: number): void;
  isCancelled?(): boolean;
}

export class AuditCancelled extends Error {
  constructor() {
    super('audit cancelled');
    this.name = 'AuditCancelled';
  }
}

const knownImf = (name: string): boolean => {
  if (IMF_NAMES.includes(name)) return true;
  try {
    resolveImf(name);
    return true;
  } catch {
    return false;
  }
};

export function runAudit(sampleCsv: string, choices: AuditChoices, hooks: AuditHooks = {}): AuditResult {
  const problems = [...validateChoices(choices), ...validateSurvey(choices.survey, 'default survey'), ...choices.surveys.flatMap((s) => validateSurvey(s))];
  for (const imf of choices.imfs) if (!knownImf(imf)) problems.push(`--imf: unknown IMF "${imf}"`);
  let sfh;
  try {
    sfh = parseSfh(choices.sfh);
  } catch (e) {
    problems.push(`--sfh: ${(e as Error).message}`);
  }
  if (problems.length || !sfh) throw new RangeError(problems.join('; '));
  const parsed = parseSample(sampleCsv, knownImf);
  const halo = makeHaloModel({ cosmology: choices.cosmology, transfer: choices.transfer, massFunction: choices.massFunction, deltaC: choices.deltaC });
  const cache = makePopulationCache(choices.metallicity);
  const surveys = new Map<string, Survey>(choices.surveys.map((s) => [s.name, s]));
  const okRows = parsed.rows.filter((r) => r.status === 'ok');
  let zTop = 1;
  for (const r of okRows) {
    const g = r.galaxy!;
    const spread = Math.max(g.zHi !== undefined ? g.zHi - g.z : 0, g.z - (g.zLo ?? g.z));
    zTop = Math.max(zTop, g.z + 5 * spread, (g.zAlt ?? 0) * 1.3);
  }
  zTop = Math.min(zTop + choices.sliceDz, 30.5);
  const ceilings = new Map<string, CeilingTable>();
  const surveyOf = (name: string | undefined): Survey => (name ? surveys.get(name)! : choices.survey);
  const ctx: AuditContext = {
    halo,
    cache,
    sfh,
    choices,
    ceilingFor: (name) => {
      const s = surveyOf(name);
      let c = ceilings.get(s.name);
      if (!c) {
        c = makeCeilingTable(halo, s.areaArcmin2, choices.quantile, 0.05, zTop, choices.sliceDz);
        ceilings.set(s.name, c);
      }
      return c;
    },
    sigmaDmFor: (() => {
      const memo = new Map<string, number>();
      return (name: string | undefined, z: number): number => {
        const s = surveyOf(name);
        const zr = Math.round(z * 4) / 4; // σ_dm changes slowly with z: evaluated on a 0.25 grid
        const key = `${s.name}@${zr}`;
        let v = memo.get(key);
        if (v === undefined) {
          const bg = halo.background;
          const half = choices.sliceDz / 2;
          const lPerp = bg.transverseComovingDistanceMpc(zr) * Math.sqrt(s.areaArcmin2) * (Math.PI / 10800);
          const lz = bg.comovingDistanceMpc(zr + half) - bg.comovingDistanceMpc(Math.max(0, zr - half));
          v = boxSigmaDm(halo.power, lPerp, lz) * halo.growth.d(zr);
          memo.set(key, v);
        }
        return v;
      };
    })(),
  };
  const galaxies: GalaxyRow[] = [];
  let done = 0;
  for (const r of parsed.rows) {
    if (hooks.isCancelled?.()) throw new AuditCancelled();
    const base = { row: r.row, id: (r.raw.id ?? '').trim(), input: r.raw, survey: r.galaxy?.survey ?? choices.survey.name };
    if (r.status === 'rejected') {
      galaxies.push({ ...base, status: 'rejected', errors: [...r.errors] });
    } else if (r.galaxy!.survey && !surveys.has(r.galaxy!.survey)) {
      galaxies.push({ ...base, status: 'rejected', errors: [{ row: r.row, column: 'survey', reason: `"${r.galaxy!.survey}" is not in the surveys file (known: ${[...surveys.keys()].join(', ') || 'none'})` }] });
    } else {
      try {
        const a = auditGalaxy(ctx, r.galaxy!, r.row);
        galaxies.push({ ...base, status: 'ok', errors: [], ...a });
      } catch (e) {
        if (!(e instanceof RangeError)) throw e;
        galaxies.push({ ...base, status: 'rejected', errors: [{ row: r.row, column: '(model)', reason: e.message }] });
      }
    }
    hooks.onProgress?.(++done, parsed.rows.length);
  }
  const binsSpec = choices.zBins.length ? choices.zBins : [[choices.survey.zMin, choices.survey.zMax] as const];
  const bins = binsSpec.map(([z0, z1]) => {
    const members: BudgetMember[] = [];
    for (const g of galaxies) {
      if (g.status !== 'ok' || g.survey !== choices.survey.name) continue;
      const z = Number(g.input.z);
      if (!(z >= z0 && z < z1)) continue;
      const h = g.imf![g.headline_imf!];
      members.push({ id: g.id, log10M: h.log_mstar_median, log10MLo: h.log_mstar_p16, log10MHi: h.log_mstar_p84 });
    }
    return binBudget(halo, choices.survey.areaArcmin2, z0, z1, choices.epsRef, members);
  });
  return {
    galaxies,
    sample: {
      bins,
      accepted: galaxies.filter((g) => g.status === 'ok').length,
      rejected: galaxies.filter((g) => g.status === 'rejected').length,
      extra_columns: parsed.extraColumns,
      file_errors: parsed.fileErrors,
    },
    caution: AUDIT_CAUTION,
    record: { tool: TOOL_NAME, version: TOOL_VERSION, format: RECORD_FORMAT, sample_csv: sampleCsv, choices },
  };
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
  return r as AuditRecord;
}
