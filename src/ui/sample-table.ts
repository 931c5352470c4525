import Papa from 'papaparse';

/** The sample as an editable grid: header + rows of cell text, to and from CSV (papaparse). */
export interface SampleGrid {
  readonly header: string[];
  readonly rows: string[][];
}

export function gridFromCsv(csv: string): SampleGrid {
  const res = Papa.parse<string[]>(csv.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy' });
  const data = res.data as string[][];
  if (!data.length) return { header: ['id', 'z', 'muv'], rows: [] };
  const header = data[0].map((h) => h.trim());
  return { header, rows: data.slice(1).map((r) => header.map((_, i) => r[i] ?? '')) };
}

export function csvFromGrid(g: SampleGrid): string {
  return Papa.unparse([g.header, ...g.rows], { newline: '\n' }) + '\n';
}

/** Text pasted from a spreadsheet (tab-separated) or as CSV, with a header row. */
export function gridFromPaste(text: string): SampleGrid {
  const delimiter = text.includes('\t') ? '\t' : ',';
  const res = Papa.parse<string[]>(text.trim(), { delimiter, skipEmptyLines: 'greedy' });
  const data = res.data as string[][];
  const header = (data[0] ?? []).map((h) => h.trim());
  return { header, rows: data.slice(1).map((r) => header.map((_, i) => r[i] ?? '')) };
}
