import { makeHaloModel, type HaloModel } from '../halos/halo-model.js';
import { makePopulationCache, type PopulationCache } from '../stars/population-cache.js';
import { isKnownImf } from './imf-check.js';
import { parseSfh } from '../stars/sfh.js';
import { makeCeilingTable, type CeilingTable } from './ceiling.js';
import { makeCeilingUncertainty, type CeilingUncertainty } from './ceiling-uncertainty.js';
import { normalizeChoices, validateChoices, type AuditChoices } from './choices.js';
import { boxSigmaDm } from './cosmic-variance.js';
import { auditGalaxy, type AuditContext, type GalaxyAudit } from './galaxy-audit.js';
import { parseSample, type LineEnd, type ParsedSample, type RowProblem } from './sample.js';
import { binBudget, type BinBudget, type BudgetMember } from './sample-budget.js';
import type { Survey } from './survey.js';
import type { Verdict } from './verdict.js';

import { RECORD_FORMAT, TOOL_NAME, TOOL_VERSION, type AuditRecord } from './record.js';
export { RECORD_FORMAT, TOOL_NAME, TOOL_VERSION };

export const AUDIT_CAUTION =
  'These results depend on the assumed stellar population (IMF, star-formation history, dust), on the redshift solutions and on the cosmology and halo mass function; the audit complements, not replaces, full spectral fitting and spectroscopic confirmation.';


export interface GalaxyRow extends Partial<GalaxyAudit> {
  readonly row: number;
  /** The physical lines of the file this row came from (1-based, inclusive) and how the last one ended. */
  readonly lines: readonly [number, number];
  readonly line_end: LineEnd;
  readonly id: string;
  readonly status: 'ok' | 'rejected';
  readonly errors: RowProblem[];
  readonly survey: string;
  readonly input: Readonly<Record<string, string>>;
  readonly verdict?: Verdict;
}

export interface AuditResult {
  readonly galaxies: GalaxyRow[];
  readonly sample: { readonly bins: BinBudget[]; readonly accepted: number; readonly rejected: number; readonly extra_columns: readonly string[]; readonly file_errors: readonly string[]; readonly file_warnings: readonly string[]; readonly lines: ParsedSample['lines'] };
  readonly caution: string;
  readonly record: AuditRecord;
}

const knownImf = isKnownImf;

/** Parsed sample plus the shared machinery (halo model, population tables, ceilings) of one audit. */
export interface PreparedAudit {
  readonly sampleCsv: string;
  readonly choices: AuditChoices;
  readonly parsed: ParsedSample;
  readonly ctx: AuditContext;
}

interface Env {
  halo: HaloModel;
  cache: PopulationCache;
  ceilings: Map<string, CeilingTable>;
  sigmaDm: Map<string, number>;
  spreads: Map<string, CeilingUncertainty>;
}
const envMemo = new Map<string, Env>();

/** Halo model, population tables and ceilings are kept between audits with the same physics (up to 4). */
function envFor(choices: AuditChoices): Env {
  const key = JSON.stringify([choices.cosmology, choices.transfer, choices.massFunction, choices.deltaC, choices.metallicity, choices.growth ?? '']);
  let e = envMemo.get(key);
  if (!e) {
    e = {
      halo: makeHaloModel({ cosmology: choices.cosmology, transfer: choices.transfer, massFunction: choices.massFunction, deltaC: choices.deltaC, growth: choices.growth }),
      cache: makePopulationCache(choices.metallicity),
      ceilings: new Map(),
      sigmaDm: new Map(),
      spreads: new Map(),
    };
    if (envMemo.size >= 4) envMemo.delete(envMemo.keys().next().value as string);
    envMemo.set(key, e);
  }
  return e;
}

/** Validates the choices (throws RangeError naming every bad one), parses the sample, builds the shared parts. */
export function prepareAudit(sampleCsv: string, given: AuditChoices): PreparedAudit {
  const problems = validateChoices(given);
  if (problems.length) throw new RangeError(problems.join('; '));
  const choices = normalizeChoices(given);
  const sfh = parseSfh(choices.sfh);
  const parsed = parseSample(sampleCsv, knownImf);
  const env = envFor(choices);
  const { halo, cache } = env;
  const surveys = new Map<string, Survey>(choices.surveys.map((s) => [s.name, s]));
  let zTop = 1;
  let zLowest = Infinity;
  let zHighest = -Infinity;
  for (const r of parsed.rows) {
    if (r.status !== 'ok') continue;
    const g = r.galaxy!;
    zLowest = Math.min(zLowest, g.z);
    zHighest = Math.max(zHighest, g.z);
    const spread = Math.max(g.zHi !== undefined ? g.zHi - g.z : 0, g.z - (g.zLo ?? g.z));
    zTop = Math.max(zTop, g.z + 5 * spread, (g.zAlt ?? 0) * 1.3, choices.survey.zMax + 1);
  }
  zTop = Math.min(Math.ceil(zTop + choices.sliceDz), 30.5);
  const surveyOf = (name: string | undefined): Survey => (name ? surveys.get(name)! : choices.survey);
  const ctx: AuditContext = {
    halo,
    cache,
    sfh,
    choices,
    ceilingFor: (name) => {
      const s = surveyOf(name);
      const key = JSON.stringify([s.areaArcmin2, choices.quantile, zTop, choices.sliceDz]);
      let c = env.ceilings.get(key);
      if (!c) {
        c = makeCeilingTable(halo, s.areaArcmin2, choices.quantile, 0.05, zTop, choices.sliceDz);
        if (env.ceilings.size > 16) env.ceilings.clear();
        env.ceilings.set(key, c);
      }
      return c;
    },
    areaFor: (name) => surveyOf(name).areaArcmin2,
    ceilingSdDexAt: (name, z) => {
      const s = surveyOf(name);
      // The z span is whole numbers around the survey and the sample, so that edits inside it reuse the spread.
      const z0 = Math.max(0.25, Math.floor(Math.min(zLowest, s.zMin)) - 1);
      const z1 = Math.min(30, Math.ceil(Math.max(zHighest, s.zMax)) + 1);
      const key = JSON.stringify([s.areaArcmin2, choices.quantile, choices.sliceDz, choices.cosmologyCovariance ?? null, z0, z1]);
      let u = env.spreads.get(key);
      if (!u) {
        u = makeCeilingUncertainty(choices, s.areaArcmin2, z0, z1);
        if (env.spreads.size > 16) env.spreads.clear();
        env.spreads.set(key, u);
      }
      return u.sdDexAt(z);
    },
    sigmaDmFor: (name, z) => {
      const s = surveyOf(name);
      const zr = Math.round(z * 4) / 4; // σ_dm changes slowly with z: evaluated on a 0.25 grid
      const key = `${s.areaArcmin2}|${choices.sliceDz}|${zr}`;
      let v = env.sigmaDm.get(key);
      if (v === undefined) {
        const bg = halo.background;
        const half = choices.sliceDz / 2;
        const lPerp = bg.transverseComovingDistanceMpc(zr) * Math.sqrt(s.areaArcmin2) * (Math.PI / 10800);
        const lz = bg.comovingDistanceMpc(zr + half) - bg.comovingDistanceMpc(Math.max(0, zr - half));
        v = boxSigmaDm(halo.power, lPerp, lz) * halo.growth.d(zr);
        env.sigmaDm.set(key, v);
      }
      return v;
    },
  };
  return { sampleCsv, choices, parsed, ctx };
}

/** The path of the first number in `v` that is NaN or ±Infinity (undefined if none). */
export function firstNonFinite(v: unknown, path: string): string | undefined {
  if (typeof v === 'number') return Number.isFinite(v) ? undefined : path || '(value)';
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const p = firstNonFinite(v[i], `${path}[${i}]`);
      if (p !== undefined) return p;
    }
  } else if (v && typeof v === 'object') {
    for (const [k, x] of Object.entries(v)) {
      const p = firstNonFinite(x, path ? `${path}.${k}` : k);
      if (p !== undefined) return p;
    }
  }
  return undefined;
}

/** Audits one parsed row (by its position in parsed.rows). */
export function auditRow(prep: PreparedAudit, index: number): GalaxyRow {
  const r = prep.parsed.rows[index];
  const choices = prep.choices;
  const named = new Set(choices.surveys.map((s) => s.name));
  const base = { row: r.row, lines: r.lines, line_end: r.lineEnd, id: (r.raw.id ?? '').trim(), input: r.raw, survey: r.galaxy?.survey ?? choices.survey.name };
  if (r.status === 'rejected') return { ...base, status: 'rejected', errors: [...r.errors] };
  if (r.galaxy!.survey && !named.has(r.galaxy!.survey)) {
    return { ...base, status: 'rejected', errors: [{ row: r.row, column: 'survey', reason: `"${r.galaxy!.survey}" is not in the surveys file (known: ${[...named].join(', ') || 'none'})` }] };
  }
  let audit: GalaxyAudit;
  try {
    audit = auditGalaxy(prep.ctx, r.galaxy!, r.row);
  } catch (e) {
    // Whatever fails while computing one galaxy rejects that galaxy, never the run.
    const reason = e instanceof Error ? e.message : String(e);
    return { ...base, status: 'rejected', errors: [{ row: r.row, column: '(model)', reason: `the audit of this galaxy failed: ${reason}` }] };
  }
  const bad = firstNonFinite(audit, '');
  if (bad !== undefined) {
    return { ...base, status: 'rejected', errors: [{ row: r.row, column: '(model)', reason: `the audit of this galaxy gave a non-finite ${bad}; this row lies outside the range where the model's tables hold, so it is not reported` }] };
  }
  return { ...base, status: 'ok', errors: [], ...audit };
}

/** Sample-level budgets and the record, from every row's result. */
export function finishAudit(prep: PreparedAudit, galaxies: GalaxyRow[]): AuditResult {
  const { choices, parsed } = prep;
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
    return binBudget(prep.ctx.halo, choices.survey.areaArcmin2, z0, z1, choices.epsRef, members, choices.quantile);
  });
  return {
    galaxies,
    sample: {
      bins,
      accepted: galaxies.filter((g) => g.status === 'ok').length,
      rejected: galaxies.filter((g) => g.status === 'rejected').length,
      extra_columns: parsed.extraColumns,
      file_errors: parsed.fileErrors,
      file_warnings: parsed.fileWarnings,
      lines: parsed.lines,
    },
    caution: AUDIT_CAUTION,
    record: { tool: TOOL_NAME, version: TOOL_VERSION, format: RECORD_FORMAT, sample_csv: prep.sampleCsv, choices },
  };
}

/** The whole audit in one call (the CLI; the worker runs the same three steps with progress). */
export function runAudit(sampleCsv: string, choices: AuditChoices): AuditResult {
  const prep = prepareAudit(sampleCsv, choices);
  return finishAudit(prep, prep.parsed.rows.map((_, i) => auditRow(prep, i)));
}

