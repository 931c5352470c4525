import { parseStrictNumber } from '../numeric/strict-number.js';

/**
 * Reads a tabulated linear P(k) at z = 0: two numeric columns per line, k [Mpc⁻¹] and P [Mpc³]
 * (no h), separated by spaces, tabs or one comma; lines starting with # are comments.
 * k must increase strictly and both columns must be > 0; at least 4 rows.
 * Problems name the line and the column.
 */
export interface PowerTable {
  readonly kMpc: number[];
  readonly pMpc3: number[];
}

export function parsePowerTable(text: string, source = 'P(k) table'): PowerTable {
  const kMpc: number[] = [];
  const pMpc3: number[] = [];
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  lines.forEach((line, i) => {
    const t = line.trim();
    if (t === '' || t.startsWith('#')) return;
    const parts = t.split(/\s*,\s*|\s+/);
    if (parts.length !== 2) throw new RangeError(`${source} line ${i + 1}: expected 2 columns (k, P), found ${parts.length}`);
    const vals = parts.map((s, c) => {
      const v = parseStrictNumber(s);
      if (!Number.isFinite(v) || v <= 0) {
        throw new RangeError(`${source} line ${i + 1}, column ${c + 1} (${c === 0 ? 'k' : 'P'}): "${s}" is not a positive number`);
      }
      return v;
    });
    if (kMpc.length && !(vals[0] > kMpc[kMpc.length - 1])) throw new RangeError(`${source} line ${i + 1}, column 1 (k): k must increase strictly`);
    kMpc.push(vals[0]);
    pMpc3.push(vals[1]);
  });
  if (kMpc.length < 4) throw new RangeError(`${source}: need at least 4 rows, found ${kMpc.length}`);
  return { kMpc, pMpc3 };
}
