import Papa from 'papaparse';
import { parseNumberCell } from './sample.js';

/** A survey field: area in arcmin² and the redshift range it searched. */
export interface Survey {
  readonly name: string;
  readonly areaArcmin2: number;
  readonly zMin: number;
  readonly zMax: number;
}

export function validateSurvey(s: Survey, where = 'survey'): string[] {
  const out: string[] = [];
  if (!s.name) out.push(`${where}: name is empty`);
  if (!(s.areaArcmin2 > 0 && s.areaArcmin2 <= 148510660.5)) out.push(`${where} "${s.name}": area must lie in (0, 148510660.5] arcmin² (got ${s.areaArcmin2})`);
  if (!(s.zMin >= 0 && s.zMax > s.zMin && s.zMax <= 30)) out.push(`${where} "${s.name}": needs 0 ≤ z_min < z_max ≤ 30 (got ${s.zMin}, ${s.zMax})`);
  return out;
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
