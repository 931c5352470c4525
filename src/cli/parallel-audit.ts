import { availableParallelism } from 'node:os';
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { auditRow, prepareAudit, type AuditChoices, type GalaxyRow, type PreparedAudit } from '../core/audit/index.js';
import { threadsFor } from '../core/audit/row-dealing.js';

/**
 * The audit's rows, in file order, from the main thread (one job) or from worker threads (each
 * builds its own halo model and tables). Rows go out in batches of BATCH, batch b to thread
 * b mod k (batches rather than single rows, so that the output can stream in file order; the thread
 * count and its threshold come from core/audit/row-dealing.ts, shared with the page's pool); a thread may run at most CREDITS batches ahead of what has been written, so memory stays
 * flat in the number of rows. Every galaxy draws from its own stream seeded by (seed, id), so the
 * numbers are identical to a serial run.
 */
const BATCH = 16;
const CREDITS = 2;

interface Job {
  readonly kind: 'baryon-audit-rows';
  readonly csv: string;
  readonly choices: AuditChoices;
  readonly batches: number[];
  readonly batchSize: number;
}
type Reply = { ok: true; batch: number; rows: GalaxyRow[] } | { ok: false; message: string };

if (!isMainThread && (workerData as Job | undefined)?.kind === 'baryon-audit-rows') {
  const job = workerData as Job;
  let credits = 0;
  let wake: (() => void) | undefined;
  parentPort!.on('message', () => {
    credits++;
    wake?.();
  });
  void (async () => {
    try {
      const prep = prepareAudit(job.csv, job.choices);
      const n = prep.parsed.rowCount;
      for (const b of job.batches) {
        while (credits === 0) await new Promise<void>((r) => (wake = r));
        credits--;
        const rows: GalaxyRow[] = [];
        for (let i = b * job.batchSize; i < Math.min(n, (b + 1) * job.batchSize); i++) rows.push(auditRow(prep, i));
        parentPort!.postMessage({ ok: true, batch: b, rows } satisfies Reply);
      }
    } catch (e) {
      parentPort!.postMessage({ ok: false, message: (e as Error).message } satisfies Reply);
    }
    parentPort!.close();
  })();
}

/** The cores this process may use (os.availableParallelism): --jobs is capped there. */
export const maxJobs = (): number => Math.max(1, availableParallelism());

export function defaultJobs(rows: number): number {
  return threadsFor(rows, maxJobs());
}

/** Every row's result in file order; `jobs` threads (one: this thread, no workers). */
export async function* auditRowsInOrder(prep: PreparedAudit, jobs: number, entry: URL): AsyncGenerator<GalaxyRow> {
  const n = prep.parsed.rowCount;
  const nb = Math.ceil(n / BATCH);
  const k = Math.max(1, Math.min(jobs, nb));
  if (k <= 1) {
    for (let i = 0; i < n; i++) yield auditRow(prep, i);
    return;
  }
  const ready = new Map<number, GalaxyRow[]>();
  let failure: Error | undefined;
  let notify: (() => void) | undefined;
  const poke = (): void => {
    const f = notify;
    notify = undefined;
    f?.();
  };
  const workers = Array.from({ length: k }, (_, w) => {
    const batches: number[] = [];
    for (let b = w; b < nb; b += k) batches.push(b);
    const worker = new Worker(entry, { workerData: { kind: 'baryon-audit-rows', csv: prep.sampleCsv, choices: prep.choices, batches, batchSize: BATCH } satisfies Job });
    worker.on('message', (m: Reply) => {
      if (m.ok) ready.set(m.batch, m.rows);
      else failure ??= new Error(`a worker thread failed: ${m.message}`);
      poke();
    });
    worker.on('error', (e) => {
      failure ??= e;
      poke();
    });
    worker.on('exit', (code) => {
      if (code !== 0) failure ??= new Error(`a worker thread stopped with code ${code}`);
      poke();
    });
    for (let c = 0; c < CREDITS; c++) worker.postMessage('credit');
    return worker;
  });
  try {
    for (let b = 0; b < nb; b++) {
      while (!ready.has(b)) {
        if (failure) throw failure;
        await new Promise<void>((r) => (notify = r));
      }
      const rows = ready.get(b)!;
      ready.delete(b);
      workers[b % k].postMessage('credit');
      yield* rows;
    }
  } finally {
    for (const w of workers) {
      w.removeAllListeners('exit');
      void w.terminate();
    }
  }
}
