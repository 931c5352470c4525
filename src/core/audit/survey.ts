import { checkSurvey } from './choice-schema.js';
import { lineRange, newlineOf, walkRecords, type RawRecord } from './csv-records.js';
import { editDistance, parseNumberCell } from './sample.js';

/** A survey field: area in arcmin² and the redshift range it searched. */
export interface Survey {
  readonly name: string;
  readonly areaArcmin2: number;
  readonly zMin: number;
  readonly zMax: number;
}

/** Problems with a survey, each naming it and the field (the ranges of SURVEY_SPECS). */
export function validateSurvey(s: Survey, where = 'survey'): string[] {
  return checkSurvey(s, where).map((p) => `${p.field}${s && typeof s.name === 'string' && s.name ? ` ("${s.name}")` : ''}: ${p.reason}`);
}

/** The file's column for each field of a Survey. */
const COLUMN_OF: Readonly<Record<string, string>> = { name: 'name', areaArcmin2: 'area_arcmin2', zMin: 'z_min', zMax: 'z_max' };

/** The columns of a surveys file, all required. */
export const SURVEY_COLUMNS = ['name', 'area_arcmin2', 'z_min', 'z_max'] as const;

export interface ParsedSurveys {
  readonly surveys: Survey[];
  /** Every problem, each naming the line (and column): any one makes the file unusable. */
  readonly errors: string[];
  /** Things worth knowing that cost nothing (an unknown column, empty lines). */
  readonly warnings: string[];
}

/** The header: our column names (matched case-insensitively and trimmed) and their positions. */
function surveyHeader(head: RawRecord, errors: string[], warnings: string[]): Map<string, number> {
  const at = new Map<string, number>();
  const where = lineRange(...head.lines);
  for (const e of head.errors) errors.push(`surveys file, header (${where}): ${e}`);
  head.cells.forEach((c, i) => {
    const name = c.trim().toLowerCase();
    if (at.has(name)) errors.push(`surveys file, header (${where}): "${c.trim()}" is named twice (columns ${at.get(name)! + 1} and ${i + 1})`);
    else at.set(name, i);
    if (name && !(SURVEY_COLUMNS as readonly string[]).includes(name)) {
      const near = SURVEY_COLUMNS.find((k) => editDistance(name, k) <= 2);
      warnings.push(`surveys file: column "${c.trim()}" is not one of ${SURVEY_COLUMNS.join(', ')} and is ignored${near && !at.has(near) ? `; did you mean "${near}"?` : ''}`);
    }
  });
  for (const f of SURVEY_COLUMNS) if (!at.has(f)) errors.push(`surveys file, header (${where}): no "${f}" column (the columns are ${SURVEY_COLUMNS.join(', ')})`);
  return at;
}

/**
 * Several surveys in one small CSV: columns name, area_arcmin2, z_min, z_max (one survey per row;
 * header names in any case; other columns ignored with a warning). A sample row's `survey` cell names
 * one of them. Read like the sample (core/audit/csv-records.ts): LF, CRLF or CR line ends, quoted cells,
 * the parser's own errors per line. Every problem is listed with its line and column; none is skipped.
 */
export function parseSurveys(text: string): ParsedSurveys {
  const clean = text.replace(/^\uFEFF/, '');
  const errors: string[] = [];
  const warnings: string[] = [];
  const surveys: Survey[] = [];
  const records: RawRecord[] = [];
  const { empty } = walkRecords(clean, { newline: newlineOf(clean) }, (rec) => void records.push(rec));
  if (!records.length) return { surveys, errors: ['surveys file: it is empty (a header name,area_arcmin2,z_min,z_max and one row per survey are needed)'], warnings };
  const at = surveyHeader(records[0], errors, warnings);
  if (errors.length) return { surveys, errors, warnings };
  const width = records[0].cells.length;
  const firstLine = new Map<string, string>();
  for (const rec of records.slice(1)) {
    const where = `surveys file, ${lineRange(...rec.lines)}`;
    const before = errors.length;
    // A record the reader could not split cleanly is reported as such, not cell by cell.
    for (const e of rec.errors) errors.push(`${where}: ${e}`);
    if (!rec.errors.length && rec.cells.length !== width) errors.push(`${where}: ${rec.cells.length} cells, but the header has ${width}`);
    if (errors.length > before) continue;
    const cell = (c: string): string => rec.cells[at.get(c)!] ?? '';
    const name = cell('name').trim();
    if (!name) errors.push(`${where}, column name: is empty`);
    const vals = (['area_arcmin2', 'z_min', 'z_max'] as const).map((c) => {
      const p = parseNumberCell(cell(c));
      if (p.value === undefined) errors.push(`${where}, column ${c}: ${p.reason ?? 'is empty'}`);
      return p.value;
    });
    if (errors.length > before) continue;
    const s: Survey = { name, areaArcmin2: vals[0]!, zMin: vals[1]!, zMax: vals[2]! };
    const problems = checkSurvey(s, '').map((p) => `${where}, column ${COLUMN_OF[p.field.slice(1)] ?? p.field.slice(1)}: ${p.reason}`);
    if (problems.length) errors.push(...problems);
    else if (firstLine.has(name)) errors.push(`${where}: the name "${name}" repeats ${firstLine.get(name)}`);
    else {
      firstLine.set(name, lineRange(...rec.lines));
      surveys.push(s);
    }
  }
  if (records.length === 1) errors.push('surveys file: the header is there but no survey follows');
  if (empty.length) warnings.push(`surveys file: ${empty.length === 1 ? 'line' : 'lines'} ${empty.join(', ')} ${empty.length === 1 ? 'is' : 'are'} empty and skipped`);
  return { surveys, errors, warnings };
}
