/**
 * How the rows of one audit are spread over threads, shared by the command line's worker threads and the
 * page's worker pool. Every row draws from its own seeded stream (seed, row), so any dealing gives the
 * same numbers as one thread; the dealing only decides the balance. Common practice, no source.
 */

/** Samples with fewer rows than this are audited on one thread: a thread's own tables cost more than the rows. */
export const POOL_MIN_ROWS = 24;

/** At least this many rows per thread, so that a thread's start-up (tables, parsing) is worth it. */
export const MIN_ROWS_PER_THREAD = 12;

/** Number of threads for `rows` rows when `cores` threads are available (always ≥ 1). */
export function threadsFor(rows: number, cores: number): number {
  if (!(rows >= POOL_MIN_ROWS) || !(cores > 1)) return 1;
  return Math.max(1, Math.min(Math.floor(cores), Math.ceil(rows / MIN_ROWS_PER_THREAD)));
}

/**
 * The row indices 0 … rows − 1 dealt round-robin over `threads` threads (row i to thread i mod threads):
 * neighbouring rows, which often have similar redshifts and costs, land on different threads.
 * Each part is in increasing order; together they hold every row exactly once.
 */
export function dealRows(rows: number, threads: number): number[][] {
  const k = Math.max(1, Math.min(Math.floor(threads), Math.max(1, rows)));
  const parts: number[][] = Array.from({ length: k }, () => []);
  for (let i = 0; i < rows; i++) parts[i % k].push(i);
  return parts;
}
