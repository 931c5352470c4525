import Papa from 'papaparse';

/** How a physical line of the file ended. */
export type LineEnd = 'LF' | 'CRLF' | 'CR' | 'none';

/** "line 4" or "lines 4–6". */
export const lineRange = (a: number, b: number): string => (a === b ? `line ${a}` : `lines ${a}–${b}`);
/** A list of line numbers, the first eight and how many more. */
export const listLines = (xs: readonly number[]): string => (xs.length > 8 ? `${xs.slice(0, 8).join(', ')} and ${xs.length - 8} more` : xs.join(', '));

/** One record of a CSV file: its cells, its physical lines (1-based, inclusive), how it ended and the parser's errors. */
export interface RawRecord {
  cells: string[];
  lines: [number, number];
  lineEnd: LineEnd;
  errors: string[];
}

/** Where a record lies in the text: character offsets [start, end), so it can be read again alone. */
export interface RecordPlace {
  start: number;
  end: number;
}

/** How the file was split: its line break and delimiter, fixed by the first reading and reused for each record alone. */
export interface Dialect {
  newline: '\n' | '\r';
  delimiter?: string;
}

/**
 * Walks the text's records with papaparse, handing each (with its physical lines, how it ended, its
 * character offsets and the parser's own errors) to `onRecord`; empty lines are listed, not handed on.
 * Line breaks are LF or CRLF (a file with CR alone is read with CR); a CR before LF is not part of the
 * last cell. Quoted cells keep their line breaks exactly. `firstLine` numbers the lines of a slice.
 */
export function walkRecords(text: string, dialect: Dialect, onRecord: (rec: RawRecord, place: RecordPlace) => boolean | void, firstLine = 1): { empty: number[]; total: number; delimiter: string } {
  const { newline } = dialect;
  const empty: number[] = [];
  let start = 0;
  let line = firstLine;
  let delimiter = dialect.delimiter ?? ',';
  let stopped = false;
  Papa.parse<string[]>(text, {
    newline,
    ...(dialect.delimiter !== undefined ? { delimiter: dialect.delimiter } : {}),
    step: (r, p) => {
      if (stopped) return;
      delimiter = r.meta.delimiter;
      const end = r.meta.cursor;
      if (end <= start && start >= text.length) return;
      const chunk = text.slice(start, end);
      let breaks = 0;
      for (let i = chunk.indexOf(newline); i >= 0; i = chunk.indexOf(newline, i + 1)) breaks++;
      const ended = chunk.endsWith(newline);
      const lineEnd: LineEnd = !ended ? 'none' : newline === '\r' ? 'CR' : chunk.endsWith('\r\n') ? 'CRLF' : 'LF';
      const last = line + breaks - (ended ? 1 : 0);
      const cells = r.data;
      if (lineEnd === 'CRLF' && cells.length && cells[cells.length - 1].endsWith('\r')) cells[cells.length - 1] = cells[cells.length - 1].slice(0, -1);
      if (cells.every((c) => c.trim() === '') && breaks <= 1) empty.push(line);
      else {
        const errors = r.errors
          .filter((e) => e.code !== 'UndetectableDelimiter')
          .map((e) => (e.code === 'MissingQuotes' ? `a quoted cell opened here is never closed, so ${lineRange(line, last)} were read as one row` : `CSV: ${e.message}`));
        if (onRecord({ cells, lines: [line, last], lineEnd, errors }, { start, end }) === false) {
          stopped = true;
          p.abort();
        }
      }
      line = last + 1;
      start = end;
    },
  });
  return { empty, total: line - firstLine, delimiter };
}

/** The line break of a text: LF if it has one (CRLF is LF with a CR the reader strips), else CR, else LF. */
export function newlineOf(text: string): '\n' | '\r' {
  return text.includes('\n') ? '\n' : text.includes('\r') ? '\r' : '\n';
}
