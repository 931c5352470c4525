/**
 * CSV text to rows of cells and back, for the page (pure). It reads exactly as the audit's reader
 * (papaparse 5 with its defaults: the line ending and the delimiter guessed, `"` quotes, `""` escapes,
 * blanks around a closing quote allowed, a malformed quote kept as text), so that the table's rows are
 * the rows the audit numbers; test/ui/csv-text.test.ts compares the two on hostile text. Writing
 * quotes a cell only when it must, as papaparse does. The page needs no CSV library of its own.
 */

const QUOTE = '"';
const GUESS_DELIMITERS = [',', '\t', '|', ';', '\x1e', '\x1f'];

/** The line ending: the one papaparse would guess (quoted text ignored, \r\n if most \r are followed by \n). */
export function guessNewline(text: string): string {
  const t = text.substring(0, 1024 * 1024).replace(/"([^]*?)"/gm, '');
  const r = t.split('\r');
  const n = t.split('\n');
  if (r.length === 1 || (n.length > 1 && n[0].length < r[0].length)) return '\n';
  const withN = r.filter((s) => s[0] === '\n').length;
  return withN >= r.length / 2 ? '\r\n' : '\r';
}

/** Rows of `input` split by `delim` and `newline`, quotes honoured; at most `limit` rows. */
export function splitRows(input: string, delim: string, newline: string, limit = Infinity): string[][] {
  const data: string[][] = [];
  if (!input) return data;
  const len = input.length;
  let row: string[] = [];
  let cursor = 0;
  let nextDelim = input.indexOf(delim, cursor);
  let nextNewline = input.indexOf(newline, cursor);
  const unescape = (s: string) => s.replace(/""/g, QUOTE);
  const finish = (value: string = input.substring(cursor)): string[][] => {
    row.push(value);
    data.push(row);
    return data.slice(0, limit);
  };
  const saveRow = (to: number) => {
    cursor = to;
    data.push(row);
    row = [];
    nextNewline = input.indexOf(newline, cursor);
  };
  for (;;) {
    if (input[cursor] === QUOTE) {
      let q = cursor;
      cursor++;
      for (;;) {
        q = input.indexOf(QUOTE, q + 1);
        if (q === -1) return finish(); // unterminated: the rest is the cell, as written
        if (q === len - 1) return finish(unescape(input.substring(cursor, q)));
        if (input[q + 1] === QUOTE) {
          q++;
          continue;
        }
        if (nextDelim !== -1 && nextDelim < q + 1) nextDelim = input.indexOf(delim, q + 1);
        if (nextNewline !== -1 && nextNewline < q + 1) nextNewline = input.indexOf(newline, q + 1);
        const spaces = (index: number): number => {
          if (index === -1) return 0;
          const between = input.substring(q + 1, index);
          return between && between.trim() === '' ? between.length : 0;
        };
        const toDelim = spaces(nextNewline === -1 ? nextDelim : Math.min(nextDelim, nextNewline));
        if (input.substr(q + 1 + toDelim, delim.length) === delim) {
          row.push(unescape(input.substring(cursor, q)));
          cursor = q + 1 + toDelim + delim.length;
          if (nextDelim !== -1 && nextDelim < cursor) nextDelim = input.indexOf(delim, cursor);
          if (nextNewline !== -1 && nextNewline < cursor) nextNewline = input.indexOf(newline, cursor);
          break;
        }
        const toNewline = spaces(nextNewline);
        if (input.substring(q + 1 + toNewline, q + 1 + toNewline + newline.length) === newline) {
          row.push(unescape(input.substring(cursor, q)));
          saveRow(q + 1 + toNewline + newline.length);
          if (nextDelim !== -1 && nextDelim < cursor) nextDelim = input.indexOf(delim, cursor);
          if (data.length >= limit) return data.slice(0, limit);
          break;
        }
        // A quote inside a quoted cell that neither ends it nor is doubled: kept as text; search on.
      }
      continue;
    }
    if (nextDelim !== -1 && (nextDelim < nextNewline || nextNewline === -1)) {
      row.push(input.substring(cursor, nextDelim));
      cursor = nextDelim + delim.length;
      nextDelim = input.indexOf(delim, cursor);
      continue;
    }
    if (nextNewline !== -1) {
      row.push(input.substring(cursor, nextNewline));
      saveRow(nextNewline + newline.length);
      if (data.length >= limit) return data.slice(0, limit);
      continue;
    }
    break;
  }
  return finish();
}

const isEmptyLine = (r: readonly string[]): boolean => r.length === 1 && r[0].length === 0;

/** The delimiter papaparse would guess: the candidate giving the steadiest cell count over 10 rows (≥ 2 cells), else ','. */
export function guessDelimiter(input: string, newline: string, skipEmpty: boolean): string {
  let best: string | undefined;
  let bestDelta = 0;
  let bestCount = 0;
  for (const d of GUESS_DELIMITERS) {
    const rows = splitRows(input, d, newline, 10);
    let delta = 0;
    let sum = 0;
    let empty = 0;
    let prev: number | undefined;
    for (const r of rows) {
      if (skipEmpty && isEmptyLine(r)) {
        empty++;
        continue;
      }
      sum += r.length;
      if (prev === undefined) prev = r.length;
      else if (r.length > 0) {
        delta += Math.abs(r.length - prev);
        prev = r.length;
      }
    }
    const avg = rows.length ? sum / (rows.length - empty) : 0;
    if (avg > 1.99 && (best === undefined || delta < bestDelta || (delta === bestDelta && avg > bestCount))) {
      best = d;
      bestDelta = delta;
      bestCount = avg;
    }
  }
  return best ?? ',';
}

/**
 * Rows of cells. A leading byte-order mark is dropped; `skipEmptyLines` drops lines with nothing on
 * them (not lines of empty cells). The delimiter is guessed unless given.
 */
export function readCsv(text: string, opts: { delimiter?: string; skipEmptyLines?: boolean } = {}): string[][] {
  const input = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const newline = guessNewline(input);
  const skip = opts.skipEmptyLines ?? false;
  const delim = opts.delimiter ?? guessDelimiter(input, newline, skip);
  const rows = splitRows(input, delim, newline);
  return skip ? rows.filter((r) => !isEmptyLine(r)) : rows;
}

/** One cell as written: quoted when it holds a quote, the delimiter, a line break or a byte-order mark, or starts or ends with a space. */
function writeCell(s: string, delim: string): string {
  const esc = s.replace(/"/g, '""');
  const quote = /[\r\n"\ufeff]/.test(esc) || esc.includes(delim) || esc.startsWith(' ') || esc.endsWith(' ');
  return quote ? `"${esc}"` : esc;
}

/** Rows as CSV text, `newline` between rows (none after the last). */
export function writeCsv(rows: readonly (readonly string[])[], newline = '\n', delim = ','): string {
  return rows.map((r) => r.map((c) => writeCell(c, delim)).join(delim)).join(newline);
}
