import { readCsv, writeCsv } from './csv-text.js';

/** The sample as an editable grid: header + rows of cell text, to and from CSV (read as the audit reads it). */
export interface SampleGrid {
  readonly header: readonly string[];
  readonly rows: readonly (readonly string[])[];
}

/** Rows whose cells are all blank: kept in the table, skipped by the audit (as its CSV reader does). */
export const isBlankRow = (r: readonly string[]): boolean => r.every((c) => c.trim() === '');

/** Reads the sample text; blank rows are kept (so a row just added survives a round trip). */
export function gridFromCsv(csv: string): SampleGrid {
  const data = readCsv(csv, { skipEmptyLines: true });
  if (!data.length) return { header: ['id', 'z', 'muv'], rows: [] };
  const header = data[0].map((h) => h.trim());
  return { header, rows: data.slice(1).map((r) => header.map((_, i) => r[i] ?? '')) };
}

export function csvFromGrid(g: SampleGrid): string {
  return writeCsv([g.header, ...g.rows]) + '\n';
}

/**
 * For each table row (0-based), the audit's 1-based row number, or 0 for a blank row the audit skips.
 * The audit numbers rows after dropping blank ones.
 */
export function auditRowNumbers(g: SampleGrid): Int32Array {
  const out = new Int32Array(g.rows.length);
  let n = 0;
  g.rows.forEach((r, i) => (out[i] = isBlankRow(r) ? 0 : ++n));
  return out;
}
