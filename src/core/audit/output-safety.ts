import { isStrictNumber } from '../numeric/strict-number.js';

/**
 * Safe cells and text for the reports a user opens in a spreadsheet or a Markdown viewer.
 *
 * CSV: a text cell starting with =, +, -, @, a tab or a carriage return is read as a formula by
 * spreadsheets; it is prefixed with a single quote, the OWASP "CSV injection" advice (common
 * practice, no source). A cell that is a strict number (e.g. "-20.5", "1e-3") is data, not a
 * formula, and stays as it is, so numbers stay numeric.
 */
export function safeCsvText(s: string): string {
  if (s === '' || isStrictNumber(s.trim())) return s;
  return /^[\t\r]|^\s*[=+\-@]/.test(s) ? `'${s}` : s;
}

/** One CSV cell (RFC 4180 quoting; text neutralised by safeCsvText). Refuses non-finite numbers. */
export function csvCell(v: string | number | undefined | null): string {
  if (v === undefined || v === null) return '';
  if (typeof v === 'number') {
    if (!Number.isFinite(v)) throw new RangeError(`internal: a non-finite number (${v}) reached the CSV`);
    return String(v);
  }
  const s = safeCsvText(v);
  return /[",\n\r]|^\s|\s$/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function csvLine(cells: readonly (string | number | undefined | null)[]): string {
  return cells.map(csvCell).join(',');
}

/**
 * A user string (id, note, survey name, a reason quoting a cell) as inert Markdown text: HTML
 * special characters become entities (no tag or attribute survives), Markdown's inline markup
 * characters are backslash-escaped (no link, image, emphasis or code span can be formed, so
 * `[x](javascript:…)` stays text), and line breaks become spaces (no new block can start).
 * CommonMark 0.31 §2.4 (backslash escapes) and §6.6 (raw HTML).
 */
export function escapeMarkdown(s: string): string {
  return s
    .replace(/\r\n|[\r\n\u2028\u2029]/g, ' ')
    .replace(/[\\`*_{}[\]()!~|#]/g, (c) => `\\${c}`)
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}
