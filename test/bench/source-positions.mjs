// Maps positions in a built bundle back to the TypeScript source through its source map (the "mappings"
// field: base64 VLQ, Source Map Revision 3 format). For the page profile's function names; a diagnostic.
import { readFileSync } from 'node:fs';

const B64 = new Map([...'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/'].map((c, i) => [c, i]));

/** Decodes one segment of base64 VLQ numbers. */
function vlq(seg) {
  const out = [];
  let v = 0;
  let shift = 0;
  for (const ch of seg) {
    const d = B64.get(ch);
    v += (d & 31) << shift;
    if (d & 32) shift += 5;
    else {
      out.push(v & 1 ? -(v >>> 1) : v >>> 1);
      v = 0;
      shift = 0;
    }
  }
  return out;
}

/** A lookup (0-based line, 0-based column in the bundle) → "src/file.ts:line" for the map file `mapPath`. */
export function sourceLookup(mapPath) {
  const map = JSON.parse(readFileSync(mapPath, 'utf8'));
  const lines = map.mappings.split(';');
  const segs = [];
  let src = 0;
  let sl = 0;
  for (const line of lines) {
    let col = 0;
    const row = [];
    for (const s of line ? line.split(',') : []) {
      const f = vlq(s);
      col += f[0];
      if (f.length >= 4) {
        src += f[1];
        sl += f[2];
        row.push([col, src, sl]);
      }
    }
    segs.push(row);
  }
  const name = (i) => map.sources[i].replace(/^(\.\.\/)+/, '');
  return (line, column) => {
    const row = segs[line];
    if (!row?.length) return undefined;
    let lo = 0;
    let hi = row.length - 1;
    if (row[0][0] > column) return undefined;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (row[mid][0] <= column) lo = mid;
      else hi = mid - 1;
    }
    return `${name(row[lo][1])}:${row[lo][2] + 1}`;
  };
}
