/**
 * Joins contour segments (as marching squares gives them, one per grid cell) into polylines, so that a
 * dashed contour keeps one dash pattern along its length. Ends meet when they agree to 1e-9 of the
 * coordinates' span (the same cell-edge crossing is computed from either side of the edge).
 */
export function chainSegments(segments: readonly (readonly [number, number])[][]): [number, number][][] {
  if (!segments.length) return [];
  const all = segments.flat();
  const span = Math.max(1e-300, ...[0, 1].map((k) => Math.max(...all.map((p) => p[k])) - Math.min(...all.map((p) => p[k]))));
  const key = (p: readonly [number, number]): string => `${Math.round(p[0] / (span * 1e-9))},${Math.round(p[1] / (span * 1e-9))}`;
  const ends = new Map<string, number[]>();
  segments.forEach((s, i) => {
    for (const p of [s[0], s[s.length - 1]]) {
      const k = key(p);
      ends.set(k, [...(ends.get(k) ?? []), i]);
    }
  });
  const used = new Uint8Array(segments.length);
  const out: [number, number][][] = [];
  const grow = (line: [number, number][]): void => {
    for (;;) {
      const tail = line[line.length - 1];
      const next = (ends.get(key(tail)) ?? []).find((j) => !used[j]);
      if (next === undefined) return;
      used[next] = 1;
      const s = segments[next].map((p) => [p[0], p[1]] as [number, number]);
      if (key(s[0]) !== key(tail)) s.reverse();
      line.push(...s.slice(1));
    }
  };
  segments.forEach((s, i) => {
    if (used[i]) return;
    used[i] = 1;
    const line = s.map((p) => [p[0], p[1]] as [number, number]);
    grow(line);
    line.reverse();
    grow(line);
    out.push(line);
  });
  return out;
}
