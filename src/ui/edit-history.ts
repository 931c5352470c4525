/**
 * Undo/redo history of immutable snapshots (pure: no DOM). `record` pushes the present onto the past
 * and clears the future; `undo`/`redo` move one step. The past is bounded by a count and by a total
 * size (so a large sample cannot fill the memory); the oldest entries go first.
 */
export interface EditHistory<T> {
  readonly past: readonly T[];
  readonly present: T;
  readonly future: readonly T[];
}

export interface HistoryLimits<T> {
  /** Most snapshots kept in the past (default 200). */
  readonly maxEntries?: number;
  /** Most total size kept in the past and future, in units of `sizeOf` (default unbounded). */
  readonly maxSize?: number;
  readonly sizeOf?: (s: T) => number;
}

export function startHistory<T>(present: T): EditHistory<T> {
  return { past: [], present, future: [] };
}

export const canUndo = <T>(h: EditHistory<T>): boolean => h.past.length > 0;
export const canRedo = <T>(h: EditHistory<T>): boolean => h.future.length > 0;

/** A new present; no-op when `same(present, next)` (default: ===). */
export function record<T>(h: EditHistory<T>, next: T, limits: HistoryLimits<T> = {}, same: (a: T, b: T) => boolean = Object.is): EditHistory<T> {
  if (same(h.present, next)) return h;
  const maxEntries = limits.maxEntries ?? 200;
  let past = [...h.past, h.present];
  if (past.length > maxEntries) past = past.slice(past.length - maxEntries);
  if (limits.maxSize !== undefined && limits.sizeOf) {
    const size = limits.sizeOf;
    let total = past.reduce((a, s) => a + size(s), 0);
    let drop = 0;
    while (drop < past.length && total > limits.maxSize) total -= size(past[drop++]);
    past = past.slice(drop);
  }
  return { past, present: next, future: [] };
}

export function undo<T>(h: EditHistory<T>): EditHistory<T> {
  if (!h.past.length) return h;
  return { past: h.past.slice(0, -1), present: h.past[h.past.length - 1], future: [h.present, ...h.future] };
}

export function redo<T>(h: EditHistory<T>): EditHistory<T> {
  if (!h.future.length) return h;
  return { past: [...h.past, h.present], present: h.future[0], future: h.future.slice(1) };
}
