/**
 * The audit worker: runs the numeric core off the main thread, exposed through comlink. One request
 * at a time; between galaxies it yields to the event loop so that cancel() (or a newer request)
 * stops a run early. Figure columns come back as typed arrays whose buffers are transferred.
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
}

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

function respond(req: AuditRequest, prep: ReturnType<typeof prepareAudit>, galaxies: GalaxyRow[], elapsedMs: number): AuditResponse {
  const result = finishAudit(prep, galaxies);
  const s = req.choices.survey;
  const curves = ceilingCurves(prep.ctx.halo, prep.ctx.ceilingFor(undefined), req.choices.epsRef, Math.max(0.5, s.zMin - 1), s.zMax + 1);
  const imfs = [...new Set(result.galaxies.flatMap((g) => (g.imf ? Object.keys(g.imf) : [])))];
  const points = galaxyPoints(result, imfs);
  const resp: AuditResponse = { id: req.id, status: 'done', result, curves, points, markdown: auditMarkdown(result), csv: auditCsv(result), elapsedMs };
  return Comlink.transfer(resp, [...buffers(curves as unknown as Record<string, unknown>), ...points.flatMap((p) => buffers(p as unknown as Record<string, unknown>))]);
}
const tick = (): Promise<void> => new Promise((r) => setTimeout(r, 0));

function buffers(x: { [k: string]: unknown } | undefined): ArrayBuffer[] {
  if (!x) return [];
  return Object.values(x).filter((v): v is Float64Array => v instanceof Float64Array).map((v) => v.buffer as ArrayBuffer);
}

export const auditApi = {
  async run(req: AuditRequest, onProgress?: (done: number, total: number) => void): Promise<AuditResponse> {
    current = req.id;
    const t0 = performance.now();
    const prep = prepareAudit(req.csv, req.choices);
    const n = prep.parsed.rows.length;
    const galaxies: GalaxyRow[] = [];
    for (let i = 0; i < n; i++) {
      if (current !== req.id) return { id: req.id, status: 'cancelled', elapsedMs: performance.now() - t0 };
      galaxies.push(auditRow(prep, i));
      if (onProgress) await onProgress(i + 1, n);
      if (i % 2 === 1) await tick();
    }
    if (current !== req.id) return { id: req.id, status: 'cancelled', elapsedMs: performance.now() - t0 };
    return respond(req, prep, galaxies, performance.now() - t0);
  },
  /** Number of data rows the sample parses to (for dealing rows over the pool). */
  rowCount(csv: string, choices: AuditChoices): number {
    return prepareAudit(csv, choices).parsed.rows.length;
  },
  /** Pool member: audits only the rows at `indices` (each row has its own seeded stream). */
  async runRows(req: AuditRequest, indices: number[], onProgress?: (done: number) => void): Promise<[number, GalaxyRow][] | 'cancelled'> {
    current = req.id;
    const prep = prepareAudit(req.csv, req.choices);
    const out: [number, GalaxyRow][] = [];
    for (let j = 0; j < indices.length; j++) {
      if (current !== req.id) return 'cancelled';
      out.push([indices[j], auditRow(prep, indices[j])]);
      if (onProgress) await onProgress(j + 1);
      if (j % 2 === 1) await tick();
    }
    return current === req.id ? out : 'cancelled';
  },
  /** Pool leader: the sample level, figures and reports from every row's result. */
  finish(req: AuditRequest, galaxies: GalaxyRow[], elapsedMs: number): AuditResponse {
    return respond(req, prepareAudit(req.csv, req.choices), galaxies, elapsedMs);
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
  /** For the recovery tests: a request that throws inside the worker. */
  fail(message: string): never {
    throw new Error(message);
  },
};

export type AuditApi = typeof auditApi;

Comlink.expose(auditApi);
