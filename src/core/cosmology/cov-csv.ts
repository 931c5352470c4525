import Papa from 'papaparse';
import { parseStrictNumber } from '../numeric/strict-number.js';
import { BASE_PARAM_NAMES } from './base-params.js';
import { covarianceProblems, type ParamCovariance } from './parameter-covariance.js';

/** One problem in a covariance file: 1-based line, the column's header name (or null for the file), why. */
export interface CovarianceCsvProblem {
  readonly row: number | null;
  readonly column: string | null;
  readonly message: string;
}

export class CovarianceCsvError extends Error {
  readonly problems: readonly CovarianceCsvProblem[];
  constructor(source: string, problems: readonly CovarianceCsvProblem[]) {
    super(`${source}: ${problems.map((p) => (p.row !== null ? `line ${p.row}${p.column ? `, column ${p.column}` : ''}: ` : '') + p.message).join('; ')}`);
    this.name = 'CovarianceCsvError';
    this.problems = problems;
  }
}

/**
 * Reads a covariance of the base parameters from CSV text:
 *
 *   param,omega_b_h2,omega_c_h2,h0,n_s,sigma8
 *   omega_b_h2,1.96e-8,0,0,0,0
 *   …
 *
 * The first header cell labels the name column (any text); the other header cells and the first cell
 * of every row are base-parameter names (omega_b_h2, omega_c_h2, h0, n_s, sigma8), in any order, the
 * same set for rows and columns. Entries are in the products of the parameters' units (h0 in
 * km/s/Mpc, so its variance in (km/s/Mpc)²), written as plain decimals or exponent notation.
 * Parameters the file leaves out are held fixed (zero variance), and `source` says so. The matrix must be
 * symmetric and positive semi-definite. Throws a CovarianceCsvError naming line and column of every problem.
 *
 * @param text the file's text; @param sourceName a name for messages and for `source` (e.g. the file name).
 */
export function parseCovarianceCsv(text: string, sourceName = 'covariance file'): ParamCovariance {
  const fail = (problems: CovarianceCsvProblem[]): never => {
    throw new CovarianceCsvError(sourceName, problems);
  };
  // One CSV record per non-blank line, so every message can give the file's own line number.
  const lines: { line: number; cells: string[] }[] = [];
  text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/).forEach((l, i) => {
    if (l.trim() === '') return;
    const cells = (Papa.parse<string[]>(l, { delimiter: ',' }).data[0] ?? []).map((c) => c.trim());
    lines.push({ line: i + 1, cells });
  });
  if (!lines.length) fail([{ row: null, column: null, message: `the file is empty; expected a header row "param,${BASE_PARAM_NAMES.join(',')}" and one row per parameter` }]);
  const { line: headerLine, cells: header } = lines[0];
  const names = header.slice(1);
  const nameCol = header[0] || 'name';
  const problems: CovarianceCsvProblem[] = [];
  if (!names.length) fail([{ row: headerLine, column: null, message: `the header needs a name column and the parameter columns (any of ${BASE_PARAM_NAMES.join(', ')})` }]);
  names.forEach((n, k) => {
    if (!BASE_PARAM_NAMES.includes(n)) problems.push({ row: headerLine, column: n || `#${k + 2}`, message: `unknown parameter "${n}" (allowed: ${BASE_PARAM_NAMES.join(', ')})` });
    else if (names.indexOf(n) !== k) problems.push({ row: headerLine, column: n, message: `parameter "${n}" appears twice in the header` });
  });
  if (problems.length) fail(problems);
  const values = new Map<string, { line: number; v: number[] }>();
  for (const { line, cells } of lines.slice(1)) {
    const name = cells[0];
    if (cells.length !== header.length) problems.push({ row: line, column: null, message: `has ${cells.length} cells where the header has ${header.length}` });
    else if (!names.includes(name)) problems.push({ row: line, column: nameCol, message: `row name "${name}" is not one of the header's parameters (${names.join(', ')})` });
    else if (values.has(name)) problems.push({ row: line, column: nameCol, message: `parameter "${name}" has a second row (first on line ${values.get(name)!.line})` });
    else {
      const v = cells.slice(1).map((cell, k) => {
        const x = parseStrictNumber(cell);
        if (!Number.isFinite(x)) problems.push({ row: line, column: names[k], message: `"${cell}" is not a finite number (write plain decimals or exponent notation, e.g. 1.96e-8)` });
        return x;
      });
      values.set(name, { line, v });
    }
  }
  if (!problems.length) for (const n of names) if (!values.has(n)) problems.push({ row: null, column: n, message: `parameter "${n}" has a column but no row` });
  if (problems.length) fail(problems);
  // Full matrix in BASE_PARAM_NAMES order; left-out parameters get zero rows and columns.
  const entry = (ri: string, cj: string): number => (values.has(ri) && values.has(cj) ? values.get(ri)!.v[names.indexOf(cj)] : 0);
  const matrix = BASE_PARAM_NAMES.map((ri) => BASE_PARAM_NAMES.map((cj) => entry(ri, cj)));
  const found = covarianceProblems(matrix);
  if (found.length) fail(found.map((q) => ({ row: q.row ? (values.get(q.row)?.line ?? null) : null, column: q.column, message: q.row ? `(row ${q.row}) ${q.message}` : q.message })));
  const fixed = BASE_PARAM_NAMES.filter((n) => !values.has(n));
  return { matrix, source: fixed.length ? `${sourceName}; held fixed: ${fixed.join(', ')}` : sourceName };
}
