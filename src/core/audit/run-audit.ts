import { makeHaloModel, type HaloModel } from '../halos/halo-model.js';
import { makePopulationCache, type PopulationCache } from '../stars/population-cache.js';
import { isKnownImf } from './imf-check.js';
import { parseSfh } from '../stars/sfh.js';
import { makeCeilingTable, type CeilingTable } from './ceiling.js';
import { makeCeilingUncertainty, type CeilingUncertainty } from './ceiling-uncertainty.js';
import { normalizeChoices, validateChoices, type AuditChoices } from './choices.js';
import { boxSigmaDm } from './cosmic-variance.js';
import { auditGalaxy, type AuditContext, type GalaxyAudit, type GalaxyAuditOptions } from './galaxy-audit.js';
import { indexSample, type LineEnd, type RowProblem, type SampleFile, type SampleIndex, type SampleRow } from './sample.js';
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
  readonly sample: { readonly bins: BinBudget[]; readonly accepted: number; readonly rejected: number; readonly extra_columns: readonly string[]; readonly file_errors: readonly string[]; readonly file_warnings: readonly string[]; readonly lines: SampleFile['lines'] };
  readonly caution: string;
  readonly record: AuditRecord;
}

const knownImf = isKnownImf;

/** The indexed sample plus the shared machinery (halo model, population tables, ceilings) of one audit. */
export interface PreparedAudit {
  readonly sampleCsv: string;
  readonly choices: AuditChoices;
  /** The sample's file-level facts and an index of its rows (each read again when it is audited). */
  readonly parsed: SampleIndex;
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
  const parsed = indexSample(sampleCsv, knownImf);
  const env = envFor(choices);
  const { halo, cache } = env;
  const surveys = new Map<string, Survey>(choices.surveys.map((s) => [s.name, s]));
  const { accepted, zLowest, zHighest, zReach } = parsed.summary;
  // The ceiling tables reach past every accepted row's redshift draws and the survey (1 with no accepted row).
  const zTop = Math.min(Math.ceil((accepted > 0 ? Math.max(1, zReach, choices.survey.zMax + 1) : 1) + choices.sliceDz), 30.5);
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

/** Audits one row of the sample (by its position, 0 for the first data row; `r` if already read). */
export function auditRow(prep: PreparedAudit, index: number, r: SampleRow = prep.parsed.rowAt(index), options: GalaxyAuditOptions = {}): GalaxyRow {
  const choices = prep.choices;
  const named = new Set(choices.surveys.map((s) => s.name));
  const base = { row: r.row, lines: r.lines, line_end: r.lineEnd, id: (r.raw.id ?? '').trim(), input: r.raw, survey: r.galaxy?.survey ?? choices.survey.name };
  if (r.status === 'rejected') return { ...base, status: 'rejected', errors: [...r.errors] };
  if (r.galaxy!.survey && !named.has(r.galaxy!.survey)) {
    return { ...base, status: 'rejected', errors: [{ row: r.row, column: 'survey', reason: `"${r.galaxy!.survey}" is not in the surveys file (known: ${[...named].join(', ') || 'none'})` }] };
  }
  let audit: GalaxyAudit;
  try {
    audit = auditGalaxy(prep.ctx, r.galaxy!, r.row, options);
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

/**
 * What the sample level keeps of the rows as they are audited: the counts, and per redshift bin the
 * members of the cumulative densities (a few numbers a galaxy), so a streamed audit keeps no rows.
 */
export interface SampleTally {
  accepted: number;
  rejected: number;
  readonly bins: readonly (readonly [number, number])[];
  readonly members: BudgetMember[][];
}

export function newTally(prep: PreparedAudit): SampleTally {
  const { choices } = prep;
  const bins = choices.zBins.length ? choices.zBins : [[choices.survey.zMin, choices.survey.zMax] as const];
  return { accepted: 0, rejected: 0, bins, members: bins.map(() => []) };
}

/** Adds one audited row: counted, and a member of every bin of the default survey its z lies in. */
export function tallyRow(prep: PreparedAudit, tally: SampleTally, g: GalaxyRow): void {
  if (g.status !== 'ok') {
    tally.rejected++;
    return;
  }
  tally.accepted++;
  if (g.survey !== prep.choices.survey.name) return;
  const z = Number(g.input.z);
  let member: BudgetMember | undefined;
  tally.bins.forEach(([z0, z1], b) => {
    if (!(z >= z0 && z < z1)) return;
    const h = g.imf![g.headline_imf!];
    member ??= { id: g.id, log10M: h.log_mstar_median, log10MLo: h.log_mstar_p16, log10MHi: h.log_mstar_p84 };
    tally.members[b].push(member);
  });
}

/** The sample level (budgets per bin, counts, the file's facts) from the tally of every row. */
export function sampleLevel(prep: PreparedAudit, tally: SampleTally): AuditResult['sample'] {
  const { choices, parsed } = prep;
  const bins = tally.bins.map(([z0, z1], b) => binBudget(prep.ctx.halo, choices.survey.areaArcmin2, z0, z1, choices.epsRef, tally.members[b], choices.quantile));
  return {
    bins,
    accepted: tally.accepted,
    rejected: tally.rejected,
    extra_columns: parsed.extraColumns,
    file_errors: parsed.fileErrors,
    file_warnings: parsed.fileWarnings,
    lines: parsed.lines,
  };
}

/** The record that reproduces this audit: the sample as given and the choices. */
export function auditRecord(prep: PreparedAudit): AuditRecord {
  return { tool: TOOL_NAME, version: TOOL_VERSION, format: RECORD_FORMAT, sample_csv: prep.sampleCsv, choices: prep.choices };
}

/** Sample-level budgets and the record, from every row's result. */
export function finishAudit(prep: PreparedAudit, galaxies: GalaxyRow[]): AuditResult {
  const tally = newTally(prep);
  for (const g of galaxies) tallyRow(prep, tally, g);
  return { galaxies, sample: sampleLevel(prep, tally), caution: AUDIT_CAUTION, record: auditRecord(prep) };
}

/** The whole audit in one call (the CLI; the worker runs the same three steps with progress). */
export function runAudit(sampleCsv: string, choices: AuditChoices): AuditResult {
  const prep = prepareAudit(sampleCsv, choices);
  return finishAudit(prep, Array.from({ length: prep.parsed.rowCount }, (_, i) => auditRow(prep, i)));
}
