import { KNOWN_COLUMNS } from '../core/audit/sample.js';
import { isStrictNumber } from '../core/numeric/strict-number.js';
import { readCsv } from './csv-text.js';
import type { SampleGrid } from './sample-table.js';

/** A block of rows pasted from a spreadsheet (tab-separated) or as CSV, read against the table's header. */
export type PasteBlock =
  | { readonly kind: 'empty' }
  | { readonly kind: 'error'; readonly message: string }
  /** No header line, or a header naming only the table's columns (any order, any case): rows in the table's columns. */
  | { readonly kind: 'rows'; readonly rows: string[][]; readonly hadHeader: boolean }
  /** A header line that names other columns: the caller asks whether to replace or append. */
  | { readonly kind: 'other-header'; readonly header: string[]; readonly rows: string[][] };

const norm = (s: string): string => s.trim().toLowerCase();

/**
 * Whether a pasted line is a header: no cell is a number and at least one cell names a sample column
 * (a known one or one of the table's), compared case-insensitively.
 */
export function isHeaderLine(cells: readonly string[], tableHeader: readonly string[]): boolean {
  const names = new Set([...KNOWN_COLUMNS, ...tableHeader].map(norm));
  const filled = cells.map((c) => c.trim()).filter((c) => c !== '');
  return filled.length > 0 && !filled.some((c) => isStrictNumber(c)) && filled.some((c) => names.has(norm(c)));
}

export function readPasteBlock(text: string, tableHeader: readonly string[]): PasteBlock {
  const body = text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
  if (!body.trim()) return { kind: 'empty' };
  const delimiter = body.includes('\t') ? '\t' : ',';
  const data = readCsv(body, { delimiter })
    .filter((r) => r.join('').trim() !== '')
    .map((r) => r.map((c) => c.trim()));
  if (!data.length) return { kind: 'empty' };
  if (isHeaderLine(data[0], tableHeader)) {
    const header = data[0];
    const rows = data.slice(1);
    const long = rows.findIndex((r) => r.length > header.length);
    if (long >= 0) return { kind: 'error', message: `pasted line ${long + 2} has ${rows[long].length} cells but the header names ${header.length} columns` };
    const table = tableHeader.map(norm);
    // The table's own columns (all or some, in any order): nothing to add, nothing lost; append.
    const own = header.every((h) => table.includes(norm(h))) && new Set(header.map(norm)).size === header.length;
    if (!own) return { kind: 'other-header', header, rows: rows.map((r) => header.map((_, i) => r[i] ?? '')) };
    return { kind: 'rows', rows: rows.map((r) => table.map((t) => r[header.findIndex((h) => norm(h) === t)] ?? '')), hadHeader: true };
  }
  const long = data.findIndex((r) => r.length > tableHeader.length);
  if (long >= 0) {
    return { kind: 'error', message: `pasted line ${long + 1} has ${data[long].length} cells but the table has ${tableHeader.length} columns; start the block with a header line naming its columns` };
  }
  return { kind: 'rows', rows: data.map((r) => tableHeader.map((_, i) => r[i] ?? '')), hadHeader: false };
}

/** The table with rows under another header appended: columns matched by name (any case), new columns added at the end. */
export function appendWithHeader(g: SampleGrid, header: readonly string[], rows: readonly string[][]): SampleGrid {
  const merged = [...g.header];
  const at = header.map((h) => {
    const i = merged.findIndex((m) => norm(m) === norm(h));
    if (i >= 0) return i;
    merged.push(h);
    return merged.length - 1;
  });
  const widen = (r: readonly string[]) => [...r, ...new Array(merged.length - r.length).fill('')];
  const added = rows.map((r) => {
    const out = new Array<string>(merged.length).fill('');
    at.forEach((j, i) => (out[j] = r[i] ?? ''));
    return out;
  });
  return { header: merged, rows: [...g.rows.map(widen), ...added] };
}
