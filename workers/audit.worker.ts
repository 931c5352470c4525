/**
 * The audit worker: runs the numeric core off the main thread, exposed through comlink. One request
 * at a time; between galaxies it yields to the event loop so that cancel() (or a newer request)
 * stops a run early. Figure columns come back as typed arrays whose buffers are transferred.
 * Large results come back in pages of GALAXY_PAGE rows (galaxyPage), so that no single message takes
 * the page's main thread long to read; a pool member's rows go to the leader as one JSON string, which
 * the main thread passes on without reading.
 */
import * as Comlink from 'comlink';
import {
  auditCsv,
  auditMarkdown,
  auditRow,
  ceilingCurves,
  finishAudit,
  galaxyPoints,
  prepareAudit,
  type AuditChoices,
  type AuditResult,
  type CeilingCurves,
  type GalaxyPoints,
  type GalaxyRow,
} from '../src/core/audit/index.js';
import { dealRows } from '../src/core/audit/row-dealing.js';
import { disputedMap, type DisputedMap } from '../src/core/audit/disputed-map.js';
import { parseCovarianceCsv } from '../src/core/cosmology/cov-csv.js';
import type { ParamCovariance } from '../src/core/cosmology/parameter-covariance.js';
import { intrinsicUvSlope, makePopulationCache, type PopulationCache } from '../src/core/stars/index.js';
import { parseSfh } from '../src/core/stars/sfh.js';
import { makeHaloModel, MASS_FUNCTIONS } from '../src/core/halos/index.js';
import type { CosmologyParams } from '../src/core/cosmology/index.js';
import type { TransferSpec } from '../src/core/power/index.js';

export interface AuditRequest {
  readonly id: number;
  readonly csv: string;
  readonly choices: AuditChoices;
}

export interface AuditResponse {
  readonly id: number;
  readonly status: 'done' | 'cancelled';
  readonly result?: AuditResult;
  readonly curves?: CeilingCurves;
  readonly points?: GalaxyPoints[];
  /** The Markdown summary and the per-galaxy CSV, ready to download. */
  readonly markdown?: string;
  readonly csv?: string;
  readonly elapsedMs: number;
  /**
   * Galaxies in tension whose reconciliation (what it would take) was left out of this answer: a first look
   * (see auditApi.run). When it is above 0, `markdown` and `csv` are absent; the whole answer follows.
   */
  readonly reconcileLeftOut?: number;
  /**
   * Number of galaxies of the result. When it exceeds GALAXY_PAGE, `result.galaxies` comes back empty
   * and the rows are fetched with galaxyPage(id, from, to).
   */
  readonly galaxyCount?: number;
}

/** Rows per message when a result is handed over in pages (~20–40 ms to read on the main thread). */
export const GALAXY_PAGE = 500;

export interface ExplorerRequest {
  readonly cosmology: CosmologyParams;
  readonly transfer: TransferSpec;
  readonly z: number;
}

export interface ExplorerResponse {
  readonly log10M: Float64Array;
  readonly series: { name: string; label: string; log10N: Float64Array }[];
}

let current = 0;
/** Populations for the UV slope, per metallicity (see auditApi.uvSlope). */
const uvPops = new Map<number, PopulationCache>();
/** The prepared audit behind the last map (see auditApi.map). */
let mapPrep: { key: string; prep: ReturnType<typeof prepareAudit> } | undefined;

/**
 * Results of rows already audited under the same choices, keyed by (choices, row number, cells): an
 * edit to one cell re-audits one row. Safe because an accepted row's numbers depend only on these (its
 * random stream is seeded by (seed, id); the row number is named in the output). Rejected rows are not
 * kept: a repeated id's rejection depends on the other rows. Bounded; cleared when full.
 */
const rowCache = new Map<string, GalaxyRow>();
const curveCache = new Map<string, CeilingCurves>();

/**
 * Row i, from the store or audited. A first look (`firstLook`) leaves out the reconciliation of a galaxy
 * in tension; such a row is stored under a key of its own, while a galaxy within budget (whose audit is
 * the same either way) is stored as the whole row.
 */
function cachedRow(prep: ReturnType<typeof prepareAudit>, choicesKey: string, i: number, firstLook = false): GalaxyRow {
  const r = prep.parsed.rowAt(i);
  if (r.status !== 'ok') return auditRow(prep, i, r);
  const key = `${choicesKey}|${r.row}|${JSON.stringify(r.raw)}`;
  let g = rowCache.get(key) ?? (firstLook ? rowCache.get(`${key}|first look`) : undefined);
  if (!g) {
    g = auditRow(prep, i, r, { reconcile: !firstLook });
    if (rowCache.size > 20000) rowCache.clear();
    rowCache.set(firstLook && leftOut(g) ? `${key}|first look` : key, g);
  }
  return g;
}

/** Whether a row of a first look is a galaxy in tension, whose reconciliation was left out. */
const leftOut = (g: GalaxyRow): boolean => g.status === 'ok' && g.verdict !== 'within budget' && (g.reconcile?.length ?? 0) === 0;

function curvesFor(req: AuditRequest, prep: ReturnType<typeof prepareAudit>): CeilingCurves {
  const c = req.choices;
  const key = JSON.stringify([c.cosmology, c.transfer, c.massFunction, c.deltaC, c.survey, c.epsRef, c.quantile, c.sliceDz]);
  let v = curveCache.get(key);
  if (!v) {
    const s = c.survey;
    v = ceilingCurves(prep.ctx.halo, prep.ctx.ceilingFor(undefined), c.epsRef, Math.max(0.5, s.zMin - 1), s.zMax + 1);
    if (curveCache.size > 32) curveCache.clear();
    curveCache.set(key, v);
  }
  // copies: the cached arrays stay here, the copies are transferred
  return Object.fromEntries(Object.entries(v).map(([k, a]) => [k, (a as Float64Array).slice()])) as unknown as CeilingCurves;
}

/** The last large result, kept until its pages have been fetched (or a newer one replaces it). */
let paged: { id: number; galaxies: GalaxyRow[] } | undefined;
/** A pool leader's own rows of the request in flight, kept here until finish(). */
let kept: { id: number; rows: [number, GalaxyRow][] } | undefined;

/**
 * The response: sample level, curves, points and reports. `beat` is called between its steps (each
 * call posts a message at once, though this thread stays busy), so that the page's liveness check
 * hears from a worker that is still working on a large sample.
 */
function respond(req: AuditRequest, prep: ReturnType<typeof prepareAudit>, galaxies: GalaxyRow[], elapsedMs: number, beat: () => void = () => undefined, reconcileLeftOut = 0): AuditResponse {
  const result = finishAudit(prep, galaxies);
  beat();
  const curves = curvesFor(req, prep);
  const imfs = [...new Set(result.galaxies.flatMap((g) => (g.imf ? Object.keys(g.imf) : [])))];
  const points = galaxyPoints(result, imfs);
  beat();
  const n = result.galaxies.length;
  paged = n > GALAXY_PAGE ? { id: req.id, galaxies: result.galaxies } : undefined;
  const shown = paged ? { ...result, galaxies: [] } : result;
  // A first look has no reports: they would say nothing of what it would take for the galaxies in tension.
  const markdown = reconcileLeftOut ? undefined : auditMarkdown(result);
  beat();
  const csv = reconcileLeftOut ? undefined : auditCsv(result);
  beat();
  const resp: AuditResponse = { id: req.id, status: 'done', result: shown, curves, points, markdown, csv, elapsedMs, galaxyCount: n, ...(reconcileLeftOut ? { reconcileLeftOut } : {}) };
  return Comlink.transfer(resp, [...buffers(curves as unknown as Record<string, unknown>), ...points.flatMap((p) => buffers(p as unknown as Record<string, unknown>))]);
}
const tick = (): Promise<void> => new Promise((r) => setTimeout(r, 0));

/**
 * Audits the rows at `indices` for request `req`. Progress is reported at most every 100 ms and never
 * awaited; every 50 ms the loop yields so that cancel() or a newer request can stop it.
 */
async function auditIndices(req: AuditRequest, prep: ReturnType<typeof prepareAudit>, indices: number[], onProgress?: (done: number) => void, firstLook = false): Promise<[number, GalaxyRow][] | 'cancelled'> {
  current = req.id;
  const ck = JSON.stringify(req.choices);
  const out: [number, GalaxyRow][] = [];
  let lastProgress = performance.now();
  let lastTick = performance.now();
  for (let j = 0; j < indices.length; j++) {
    if (current !== req.id) return 'cancelled';
    out.push([indices[j], cachedRow(prep, ck, indices[j], firstLook)]);
    if (onProgress && performance.now() - lastProgress > 100) {
      lastProgress = performance.now();
      void onProgress(j + 1);
    }
    if (performance.now() - lastTick > 50) {
      lastTick = performance.now();
      await tick();
    }
  }
  return current === req.id ? out : 'cancelled';
}

function buffers(x: { [k: string]: unknown } | undefined): ArrayBuffer[] {
  if (!x) return [];
  return Object.values(x).filter((v): v is Float64Array => v instanceof Float64Array).map((v) => v.buffer as ArrayBuffer);
}

export const auditApi = {
  /**
   * The audit of every row. A first look (`firstLook`, for samples that fit one answer) leaves out what it
   * would take to reconcile the galaxies in tension, the slowest step, so the page can draw the figures
   * first; its answer counts them in `reconcileLeftOut` and has no reports, and the page asks a second
   * worker for the whole audit at the same time.
   */
  async run(req: AuditRequest, onProgress?: (done: number, total: number) => void, firstLook = false): Promise<AuditResponse> {
    const t0 = performance.now();
    const prep = prepareAudit(req.csv, req.choices);
    const n = prep.parsed.rowCount;
    const quick = firstLook && n <= GALAXY_PAGE;
    const rows = await auditIndices(req, prep, Array.from({ length: n }, (_, i) => i), onProgress && ((d) => onProgress(d, n)), quick);
    if (rows === 'cancelled') return { id: req.id, status: 'cancelled', elapsedMs: performance.now() - t0 };
    const galaxies = rows.map(([, g]) => g);
    const left = quick ? galaxies.filter(leftOut).length : 0;
    return respond(req, prep, galaxies, performance.now() - t0, onProgress && (() => void onProgress(n, n)), left);
  },
  /**
   * Audits every row of `req` into this worker's store of rows and answers nothing else: a second worker
   * readied this way (tables built, rows stored) gives the whole audit beside a first look at once.
   */
  async warm(req: AuditRequest): Promise<'done' | 'cancelled'> {
    const prep = prepareAudit(req.csv, req.choices);
    const n = prep.parsed.rowCount;
    const rows = await auditIndices(req, prep, Array.from({ length: Math.min(n, GALAXY_PAGE) }, (_, i) => i));
    return rows === 'cancelled' ? rows : 'done';
  },
  /**
   * Pool member `part.index` of `part.of`: parses the sample and audits its own share of the rows
   * (core/audit/row-dealing.ts; every row has its own seeded stream), so every member starts at once
   * without a round trip through the page. Progress is (rows done, rows of the sample). The leader
   * (`keep`) keeps its rows for finish() and answers their number; the others answer their rows as
   * JSON text of [index, row] pairs, which the main thread hands to the leader unread.
   */
  async runRows(req: AuditRequest, part: { index: number; of: number }, onProgress?: (done: number, total: number) => void, keep = false): Promise<string | number | 'cancelled'> {
    const prep = prepareAudit(req.csv, req.choices);
    const n = prep.parsed.rowCount;
    const indices = dealRows(n, part.of)[part.index] ?? [];
    onProgress?.(0, n);
    const rows = await auditIndices(req, prep, indices, onProgress && ((d) => onProgress(d, n)));
    if (rows === 'cancelled') return rows;
    if (!keep) return JSON.stringify(rows);
    kept = { id: req.id, rows };
    return rows.length;
  },
  /**
   * Pool leader: the sample level, figures and reports from its own rows and the other members' JSON
   * parts. `beat` (a proxy from the page) is called after each step, so the page hears from it.
   */
  finish(req: AuditRequest, parts: string[], elapsedMs: number, beat?: () => void): AuditResponse {
    const pulse = (): void => void beat?.();
    const prep = prepareAudit(req.csv, req.choices);
    pulse();
    const galaxies: GalaxyRow[] = new Array(prep.parsed.rowCount);
    const own = kept?.id === req.id ? kept.rows : [];
    kept = undefined;
    for (const [i, g] of own) galaxies[i] = g;
    for (const part of parts) {
      for (const [i, g] of JSON.parse(part) as [number, GalaxyRow][]) galaxies[i] = g;
      pulse();
    }
    const missing = galaxies.findIndex((g) => g === undefined); // findIndex visits holes too
    if (missing >= 0) throw new Error(`the pool lost row ${missing + 1} of the sample`);
    return respond(req, prep, galaxies, elapsedMs, pulse);
  },
  /** Rows from..to (exclusive) of the large result `id` (see AuditResponse.galaxyCount). */
  galaxyPage(id: number, from: number, to: number): GalaxyRow[] {
    if (paged?.id !== id) throw new Error(`result ${id} is no longer held by the worker`);
    const page = paged.galaxies.slice(from, to);
    if (to >= paged.galaxies.length) paged = undefined;
    return page;
  },
  cancel(): void {
    current = -1;
  },
  explore(req: ExplorerRequest): ExplorerResponse {
    const base = makeHaloModel({ cosmology: req.cosmology, transfer: req.transfer, massFunction: 'sheth-tormen' });
    const n = 121;
    const log10M = Float64Array.from({ length: n }, (_, i) => 7 + (9 * i) / (n - 1));
    const series = Object.values(MASS_FUNCTIONS).map((mf) => {
      const hm = makeHaloModel({ cosmology: req.cosmology, transfer: req.transfer, massFunction: mf.name }, base);
      const s = hm.slice(req.z);
      return { name: mf.name, label: mf.label, log10N: Float64Array.from(log10M, (l) => Math.log10(Math.max(s.nAbove(10 ** l), 1e-300))) };
    });
    return Comlink.transfer({ log10M, series }, [log10M.buffer as ArrayBuffer, ...series.map((s) => s.log10N.buffer as ArrayBuffer)]);
  },
  /**
   * The map of one galaxy (the fifth figure): median ε_req over redshift × IMF slope, for the row at
   * `rowIndex` of `req`'s sample. The prepared audit (and its mass-to-light tables) of the last map is kept,
   * so picking another galaxy of the same sample does not prepare it again.
   */
  map(req: AuditRequest, rowIndex: number): DisputedMap {
    const key = `${JSON.stringify(req.choices)}|${req.csv}`;
    if (!mapPrep || mapPrep.key !== key) mapPrep = { key, prep: prepareAudit(req.csv, req.choices) };
    return disputedMap(mapPrep.prep, rowIndex);
  },
  /**
   * The intrinsic UV slope β (1300–2600 Å, dust-free) of `imf` under the star-formation history `sfh` at
   * `ageMyr`, for metallicity `metallicity` (mass fraction) and redshift `z` (for IMFs that depend on it).
   */
  uvSlope(imf: string, sfh: string, metallicity: number, ageMyr: number, z: number): number {
    let cache = uvPops.get(metallicity);
    if (!cache) {
      if (uvPops.size > 8) uvPops.clear();
      cache = makePopulationCache(metallicity);
      uvPops.set(metallicity, cache);
    }
    return intrinsicUvSlope(cache.population(imf, z), parseSfh(sfh), ageMyr);
  },
  /** A covariance of the base parameters from CSV text (the core's parser; its message names line and column). */
  parseCovariance(text: string, sourceName: string): ParamCovariance {
    return parseCovarianceCsv(text, sourceName);
  },
  /** For the recovery tests: a request that throws inside the worker. */
  fail(message: string): never {
    throw new Error(message);
  },
  /** For the recovery tests: the worker stops at once, with no error event and no answer to anything. */
  stopSilently(): void {
    self.close();
  },
};

export type AuditApi = typeof auditApi;

Comlink.expose(auditApi);
