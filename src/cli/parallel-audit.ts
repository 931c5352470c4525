import { availableParallelism } from 'node:os';
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { auditRow, finishAudit, prepareAudit, runAudit, type AuditChoices, type AuditResult, type GalaxyRow } from '../core/audit/index.js';
import { dealRows, threadsFor } from '../core/audit/row-dealing.js';

/**
 * The audit on several cores: rows are dealt (core/audit/row-dealing.ts, shared with the page's pool) to
 * the main thread and N − 1 worker threads (each builds its own halo model and tables); the main thread
 * then finishes the sample level.
 * Every row draws from its own seeded stream (seed, row), so the result is identical to a serial run.
 */
interface Job {
  readonly kind: 'baryon-audit-rows';
  readonly csv: string;
  readonly choices: AuditChoices;
  readonly indices: number[];
}

if (!isMainThread && (workerData as Job | undefined)?.kind === 'baryon-audit-rows') {
  const job = workerData as Job;
  try {
    const prep = prepareAudit(job.csv, job.choices);
    parentPort!.postMessage({ ok: true, rows: job.indices.map((i) => [i, auditRow(prep, i)] as const) });
  } catch (e) {
    parentPort!.postMessage({ ok: false, message: (e as Error).message });
  }
}

export function defaultJobs(rows: number): number {
  return threadsFor(rows, availableParallelism());
}

/** The audit on `jobs` threads (one: the plain runAudit). */
export async function runAuditParallel(csv: string, choices: AuditChoices, jobs: number, entry: URL): Promise<AuditResult> {
  if (jobs <= 1) return runAudit(csv, choices);
  const prepMain = prepareAudit(csv, choices);
  const n = prepMain.parsed.rows.length;
  const parts = dealRows(n, jobs);
  // The main thread takes the first share itself (no extra thread competing for the cores).
  const [mine, ...theirs] = parts;
  const pending = Promise.all(
    theirs.map(
      (indices) =>
        new Promise<[number, GalaxyRow][]>((resolve, reject) => {
          const w = new Worker(entry, { workerData: { kind: 'baryon-audit-rows', csv, choices, indices } satisfies Job });
          w.once('message', (m: { ok: boolean; rows?: [number, GalaxyRow][]; message?: string }) => {
            void w.terminate();
            if (m.ok) resolve(m.rows!);
            else reject(new RangeError(m.message));
          });
          w.once('error', reject);
        }),
    ),
  );
  const own = mine.map((i) => [i, auditRow(prepMain, i)] as [number, GalaxyRow]);
  const results = [own, ...(await pending)];
  const galaxies: GalaxyRow[] = new Array(n);
  for (const part of results) for (const [i, row] of part) galaxies[i] = row;
  return finishAudit(prepMain, galaxies);
}
