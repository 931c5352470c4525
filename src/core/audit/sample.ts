import Papa from 'papaparse';
import { isStrictNumber } from '../numeric/strict-number.js';

/**
 * The sample file (CSV, header row). Our column names and units:
 *  id (text, required) · z (required, > 0) · z_lo, z_hi (68% interval) · z_alt, p_alt (second
 *  solution and its probability in [0, 1]) · brightness: muv (absolute AB at 1500 Å) | m_ab +
 *  lambda_obs_um (observed AB magnitude and band, μm) | log_mstar (log10 Msun) + imf_ref ·
 *  log_mstar_err (dex) · log_mstar_alt (log10 Msun if z_alt is right) · mag_err (mag) · beta ·
 *  beta_err · survey (name in the surveys file) · notes. Other columns are kept and echoed.
 */
export const KNOWN_COLUMNS = [
  'id', 'z', 'z_lo', 'z_hi', 'z_alt', 'p_alt', 'muv', 'm_ab', 'lambda_obs_um', 'log_mstar', 'imf_ref',
  'log_mstar_err', 'log_mstar_alt', 'mag_err', 'beta', 'beta_err', 'survey', 'notes',
] as const;

/**
 * The redshifts a galaxy may have. Above 30 the halo and ceiling tables end. Below 0.25 the slice's
 * box has no transverse size for the cosmic variance (σ_dm is evaluated on a 0.25 grid in z), and
 * the audit is made for early galaxies anyway.
 */
export const GALAXY_Z = { min: 0.25, max: 30, why: 'the halo tables reach z = 30, and the cosmic-variance box needs z ≥ 0.25' } as const;
/** The Monte Carlo redshift draws start at z = 0.05, so a second solution must lie above it. */
export const Z_ALT_MIN = 0.05;

const NUMERIC = ['z', 'z_lo', 'z_hi', 'z_alt', 'p_alt', 'muv', 'm_ab', 'lambda_obs_um', 'log_mstar', 'log_mstar_err', 'log_mstar_alt', 'mag_err', 'beta', 'beta_err'] as const;
type NumericColumn = (typeof NUMERIC)[number];

export interface RowProblem {
  /** 1-based data row (the header is row 0). */
  readonly row: number;
  readonly column: string;
  readonly reason: string;
}

export interface GalaxyInput {
  readonly row: number;
  readonly id: string;
  readonly z: number;
  readonly zLo?: number;
  readonly zHi?: number;
  readonly zAlt?: number;
  readonly pAlt: number;
  readonly muv?: number;
  readonly mAB?: number;
  readonly lambdaObsUm?: number;
  readonly log10Mstar?: number;
  readonly imfRef?: string;
  readonly log10MstarErr: number;
  readonly log10MstarAlt?: number;
  readonly magErr: number;
  readonly beta?: number;
  readonly betaErr: number;
  readonly survey?: string;
  readonly notes?: string;
}

export interface SampleRow {
  readonly row: number;
  /** Every cell exactly as given, by column name (unknown columns included). */
  readonly raw: Readonly<Record<string, string>>;
  readonly status: 'ok' | 'rejected';
  readonly galaxy?: GalaxyInput;
  readonly errors: readonly RowProblem[];
}

export interface ParsedSample {
  readonly columns: readonly string[];
  readonly extraColumns: readonly string[];
  readonly rows: readonly SampleRow[];
  /** Problems with the file as a whole (no header, no id/z column, …). */
  readonly fileErrors: readonly string[];
}


/** Strict number: plain decimal or exponent notation; no thousands separators, no comma decimals. */
export function parseNumberCell(text: string): { value?: number; reason?: string } {
  const s = text.trim();
  if (s === '') return {};
  if (!isStrictNumber(s)) {
    if (/^[+-]?\d{1,3}(,\d{3})+$/.test(s)) return { reason: `"${text}" has a comma: write ${s.replace(/,/g, '')} if it is a thousands separator, or ${s.replace(',', '.')} if it is a decimal comma` };
    if (/^[+-]?\d+,\d+$/.test(s)) return { reason: `"${text}" uses a comma as decimal mark; write ${s.replace(',', '.')}` };
    if (/^[+-]?\d{1,3}(,\d{3})+(\.\d+)?$/.test(s)) return { reason: `"${text}" has thousands separators; write ${s.replace(/,/g, '')}` };
    return { reason: `"${text}" is not a number` };
  }
  const v = Number(s);
  if (!Number.isFinite(v)) return { reason: `"${text}" is outside the floating-point range` };
  return { value: v };
}

export function parseSample(text: string, knownImfs: (name: string) => boolean): ParsedSample {
  const clean = text.replace(/^\uFEFF/, '');
  const res = Papa.parse<string[]>(clean, { skipEmptyLines: 'greedy' });
  const data = res.data as string[][];
  const fileErrors: string[] = [];
  if (!data.length) return { columns: [], extraColumns: [], rows: [], fileErrors: ['the sample is empty (no header row)'] };
  const header = data[0].map((h) => h.trim());
  const dup = header.find((h, i) => h !== '' && header.indexOf(h) !== i);
  if (dup) fileErrors.push(`column "${dup}" appears twice in the header`);
  for (const need of ['id', 'z']) if (!header.includes(need)) fileErrors.push(`the header has no "${need}" column (required)`);
  const extra = header.filter((h) => h !== '' && !(KNOWN_COLUMNS as readonly string[]).includes(h));
  const rows: SampleRow[] = [];
  const seenIds = new Map<string, number>();
  for (let r = 1; r < data.length; r++) {
    const cells = data[r];
    const raw: Record<string, string> = {};
    header.forEach((h, i) => {
      if (h !== '') raw[h] = cells[i] ?? '';
    });
    const errors: RowProblem[] = [];
    const bad = (column: string, reason: string): void => void errors.push({ row: r, column, reason });
    if (cells.length !== header.length) bad('(row)', `has ${cells.length} cells but the header has ${header.length}`);
    const num: Partial<Record<NumericColumn, number>> = {};
    for (const c of NUMERIC) {
      if (raw[c] === undefined) continue;
      const p = parseNumberCell(raw[c]);
      if (p.reason) bad(c, p.reason);
      else if (p.value !== undefined) num[c] = p.value;
    }
    const id = (raw.id ?? '').trim();
    if (!id) bad('id', 'is empty');
    else if (seenIds.has(id)) bad('id', `"${id}" repeats row ${seenIds.get(id)}`);
    else seenIds.set(id, r);
    if (raw.z !== undefined && num.z === undefined && !errors.some((e) => e.column === 'z')) bad('z', 'is empty (required)');
    if (num.z !== undefined && !(num.z >= GALAXY_Z.min && num.z <= GALAXY_Z.max)) bad('z', `must lie in [${GALAXY_Z.min}, ${GALAXY_Z.max}] (got ${raw.z.trim()}): ${GALAXY_Z.why}`);
    if (num.z_lo !== undefined && num.z !== undefined && !(num.z_lo <= num.z && num.z_lo >= 0)) bad('z_lo', `must lie in [0, z] (got ${num.z_lo} with z = ${num.z})`);
    if (num.z_hi !== undefined && num.z !== undefined && !(num.z_hi >= num.z && num.z_hi <= GALAXY_Z.max)) bad('z_hi', `must lie in [z, ${GALAXY_Z.max}] (got ${num.z_hi} with z = ${num.z})`);
    if (num.z_alt !== undefined && !(num.z_alt >= Z_ALT_MIN && num.z_alt <= GALAXY_Z.max)) bad('z_alt', `must lie in [${Z_ALT_MIN}, ${GALAXY_Z.max}] (got ${num.z_alt}): the redshift draws start at z = ${Z_ALT_MIN}`);
    if (num.p_alt !== undefined && !(num.p_alt >= 0 && num.p_alt <= 1)) bad('p_alt', `must lie in [0, 1] (got ${raw.p_alt.trim()})`);
    if (num.p_alt !== undefined && num.p_alt > 0 && num.z_alt === undefined) bad('p_alt', 'is given without z_alt');
    if (num.z_alt !== undefined && num.p_alt === undefined) bad('z_alt', 'is given without p_alt');
    for (const c of ['log_mstar_err', 'mag_err', 'beta_err'] as const) if (num[c] !== undefined && !(num[c]! >= 0 && num[c]! <= 5)) bad(c, `must lie in [0, 5] (got ${num[c]})`);
    if (num.lambda_obs_um !== undefined && !(num.lambda_obs_um > 0 && num.lambda_obs_um <= 30)) bad('lambda_obs_um', `must lie in (0, 30] μm (got ${num.lambda_obs_um})`);
    if (num.log_mstar !== undefined && !(num.log_mstar > 3 && num.log_mstar < 14)) bad('log_mstar', `must lie in (3, 14) log10 Msun (got ${num.log_mstar})`);
    if (num.muv !== undefined && !(num.muv > -30 && num.muv < -5)) bad('muv', `must lie in (−30, −5) AB mag (got ${num.muv})`);
    if (num.m_ab !== undefined && !(num.m_ab > 10 && num.m_ab < 40)) bad('m_ab', `must lie in (10, 40) AB mag (got ${num.m_ab})`);
    if (num.beta !== undefined && !(num.beta > -4 && num.beta < 4)) bad('beta', `must lie in (−4, 4) (got ${num.beta})`);
    const kinds = [num.muv !== undefined, num.m_ab !== undefined, num.log_mstar !== undefined].filter(Boolean).length;
    if (kinds === 0 && !errors.some((e) => ['muv', 'm_ab', 'log_mstar'].includes(e.column))) bad('muv/m_ab/log_mstar', 'no brightness: give muv, or m_ab with lambda_obs_um, or log_mstar with imf_ref');
    if (kinds > 1) bad('muv/m_ab/log_mstar', 'give only one of muv, m_ab, log_mstar');
    if (num.m_ab !== undefined && num.lambda_obs_um === undefined && !errors.some((e) => e.column === 'lambda_obs_um')) bad('lambda_obs_um', 'is needed with m_ab');
    const imfRef = (raw.imf_ref ?? '').trim() || undefined;
    if (num.log_mstar !== undefined && !imfRef) bad('imf_ref', 'is needed with log_mstar (the IMF the reported mass assumed)');
    if (imfRef && !knownImfs(imfRef)) bad('imf_ref', `"${imfRef}" is not a known IMF`);
    if (num.log_mstar_alt !== undefined && num.z_alt === undefined) bad('log_mstar_alt', 'is given without z_alt');
    if (num.log_mstar_alt !== undefined && num.log_mstar === undefined) bad('log_mstar_alt', 'needs log_mstar');
    if (errors.length) {
      rows.push({ row: r, raw, status: 'rejected', errors });
      continue;
    }
    const galaxy: GalaxyInput = {
      row: r,
      id,
      z: num.z!,
      zLo: num.z_lo,
      zHi: num.z_hi,
      zAlt: num.z_alt,
      pAlt: num.p_alt ?? 0,
      muv: num.muv,
      mAB: num.m_ab,
      lambdaObsUm: num.lambda_obs_um,
      log10Mstar: num.log_mstar,
      imfRef,
      log10MstarErr: num.log_mstar_err ?? 0,
      log10MstarAlt: num.log_mstar_alt,
      magErr: num.mag_err ?? 0,
      beta: num.beta,
      betaErr: num.beta_err ?? 0,
      survey: (raw.survey ?? '').trim() || undefined,
      notes: raw.notes,
    };
    rows.push({ row: r, raw, status: 'ok', galaxy, errors: [] });
  }
  return { columns: header, extraColumns: extra, rows, fileErrors };
}
