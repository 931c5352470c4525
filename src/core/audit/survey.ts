import Papa from 'papaparse';
import { checkSurvey } from './choice-schema.js';
import { parseNumberCell } from './sample.js';

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

/**
 * Several surveys in one small CSV: columns name, area_arcmin2, z_min, z_max (one survey per row).
 * A sample row's `survey` cell names one of them.
 */
export function parseSurveys(text: string): { surveys: Survey[]; errors: string[] } {
  const res = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy' });
  const errors: string[] = [];
  const surveys: Survey[] = [];
  const fields = res.meta.fields ?? [];
  for (const f of ['name', 'area_arcmin2', 'z_min', 'z_max']) if (!fields.includes(f)) errors.push(`surveys file: missing column "${f}"`);
  if (errors.length) return { surveys, errors };
  res.data.forEach((r, i) => {
    const vals: number[] = [];
    for (const c of ['area_arcmin2', 'z_min', 'z_max']) {
      const p = parseNumberCell(r[c] ?? '');
      if (p.value === undefined) errors.push(`surveys file row ${i + 1}, column ${c}: ${p.reason ?? 'is empty'}`);
      vals.push(p.value ?? Number.NaN);
    }
    const s: Survey = { name: (r.name ?? '').trim(), areaArcmin2: vals[0], zMin: vals[1], zMax: vals[2] };
    if (vals.every(Number.isFinite)) {
      const e = validateSurvey(s, `surveys file row ${i + 1}`);
      if (e.length) errors.push(...e);
      else if (surveys.some((x) => x.name === s.name)) errors.push(`surveys file row ${i + 1}: name "${s.name}" repeats`);
      else surveys.push(s);
    }
  });
  return { surveys, errors };
}
