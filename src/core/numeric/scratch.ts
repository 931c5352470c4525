/**
 * Named work vectors reused from call to call (grown when a longer one is asked for), so that a loop
 * over many galaxies does not allocate its per-draw arrays anew each time. A vector handed out is valid
 * until the same name is asked for again: callers use one Scratch per level of nesting.
 */
export interface Scratch {
  f64(name: string, n: number): Float64Array;
  i32(name: string, n: number): Int32Array;
}

export function makeScratch(): Scratch {
  const f = new Map<string, Float64Array>();
  const i = new Map<string, Int32Array>();
  return {
    f64: (name, n) => {
      let b = f.get(name);
      if (!b || b.length < n) {
        b = new Float64Array(Math.max(n, 1024));
        f.set(name, b);
      }
      return b.subarray(0, n);
    },
    i32: (name, n) => {
      let b = i.get(name);
      if (!b || b.length < n) {
        b = new Int32Array(Math.max(n, 1024));
        i.set(name, b);
      }
      return b.subarray(0, n);
    },
  };
}
