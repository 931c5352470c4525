import { lineRange, listLines, newlineOf, walkRecords, type Dialect, type LineEnd, type RawRecord } from './csv-records.js';
import { isStrictNumber } from '../numeric/strict-number.js';

/**
 * The sample file (CSV, header row). Our column names and units:
 *  id (text, required) · z (required, in GALAXY_Z) · z_lo, z_hi (68% interval) · z_alt, p_alt (second
 *  solution and its probability in [0, 1]) · brightness: muv (absolute AB at 1500 Å) | m_ab +
 *  lambda_obs_um (observed AB magnitude and band, μm) | log_mstar (log10 Msun) + imf_ref ·
 *  log_mstar_err (dex) · log_mstar_alt (log10 Msun if z_alt is right) · mag_err (mag) · beta ·
 *  beta_err · survey (name in the surveys file) · notes. Other columns are kept and echoed.
 * Header names match case-insensitively and trimmed.
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

export type { LineEnd } from './csv-records.js';

export interface SampleRow {
  readonly row: number;
  /** The physical lines of the file this row spans, 1-based inclusive (a quoted cell may hold line breaks). */
  readonly lines: readonly [number, number];
  /** How its last line ended. */
  readonly lineEnd: LineEnd;
  /**
   * Every cell exactly as given, by column name (unknown columns included; a header cell left empty
   * and cells beyond the header are named "(column N)"). A null-prototype object: any name is kept.
   */
  readonly raw: Readonly<Record<string, string>>;
  readonly status: 'ok' | 'rejected';
  readonly galaxy?: GalaxyInput;
  readonly errors: readonly RowProblem[];
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

/** Other names people give our columns (common practice, no source): a "did you mean" hint, never a mapping. */
const ALIASES: Readonly<Record<string, string>> = {
  redshift: 'z', zphot: 'z', z_phot: 'z', photoz: 'z', z_best: 'z', zspec: 'z', z_spec: 'z',
  m_uv: 'muv', abs_mag: 'muv', absmag: 'muv', logm: 'log_mstar', log_mass: 'log_mstar', logmstar: 'log_mstar', lgm: 'log_mstar',
  mstar: 'log_mstar', name: 'id', galaxy: 'id', object: 'id', comment: 'notes', comments: 'notes', note: 'notes',
};

/** Levenshtein distance (insert, delete, substitute; common practice, no source), capped work for short names. */
export function editDistance(a: string, b: string): number {
  if (Math.abs(a.length - b.length) > 3) return 99;
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) cur.push(Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1)));
    prev = cur;
  }
  return prev[b.length];
}

function suggestColumn(name: string): string | undefined {
  const n = name.toLowerCase().replace(/[\s-]+/g, '_');
  if (ALIASES[n]) return ALIASES[n];
  let best: string | undefined;
  let bestD = 3;
  for (const k of KNOWN_COLUMNS) {
    const d = editDistance(n, k);
    if (d < bestD && d < k.length) {
      best = k;
      bestD = d;
    }
  }
  return best;
}

/** The header's reading: column names, and the file-level problems it alone decides. */
interface HeaderFacts {
  readonly header: string[];
  /** The header's lines, and the column whose cell readRow takes as the id (the last named "id"; −1 if none). */
  readonly lines: readonly [number, number];
  readonly idColumn: number;
  readonly dupProblems: string[];
  readonly missing: string[];
  readonly extra: string[];
  readonly fatal?: string;
  readonly fileErrors: string[];
  readonly fileWarnings: string[];
}

function readHeader(head: RawRecord): HeaderFacts {
  const fileErrors: string[] = [];
  const fileWarnings: string[] = [];
  const known = KNOWN_COLUMNS as readonly string[];
  const header = head.cells.map((h, i) => {
    const t = h.trim();
    if (t === '') return `(column ${i + 1})`;
    return known.includes(t.toLowerCase()) ? t.toLowerCase() : t;
  });
  const seenCol = new Map<string, number>();
  const dupProblems: string[] = [];
  header.forEach((h, i) => {
    const k = h.toLowerCase();
    if (seenCol.has(k)) dupProblems.push(`the header names "${h}" twice (columns ${seenCol.get(k)! + 1} and ${i + 1}): which one holds the values is unclear; rename or remove one`);
    else seenCol.set(k, i);
  });
  fileErrors.push(...dupProblems);
  for (const e of head.errors) fileErrors.push(`header (${lineRange(...head.lines)}): ${e}`);
  const missing = ['id', 'z'].filter((c) => !header.includes(c));
  let fatal: string | undefined;
  if (missing.length) {
    fatal = `the first line must be a header naming the columns, with at least "id" and "z"; line ${head.lines[0]} has no ${missing.map((m) => `"${m}"`).join(' or ')} column (it reads: ${head.cells.slice(0, 6).join(',').slice(0, 80)})`;
    fileErrors.push(fatal);
  }
  const extra = header.filter((h) => !known.includes(h) && !/^\(column \d+\)$/.test(h));
  for (const h of extra) {
    const s = suggestColumn(h);
    if (s && !header.includes(s)) fileWarnings.push(`column "${h}" is not one of ours and is only echoed; did you mean "${s}"?`);
  }
  return { header, lines: head.lines, idColumn: header.lastIndexOf('id'), dupProblems, missing, extra, fatal, fileErrors, fileWarnings };
}

/** One data record (data row `r`) read and checked; `earlierRow` is the row its id first appeared on, if before it. */
function readRow(rec: RawRecord, r: number, hf: HeaderFacts, earlierRow: number | undefined, knownImfs: (name: string) => boolean): SampleRow {
  const { header, dupProblems, missing } = hf;
  const cells = rec.cells;
  const raw = Object.create(null) as Record<string, string>;
  const width = Math.max(cells.length, header.length);
  for (let i = 0; i < width; i++) raw[i < header.length ? header[i] : `(column ${i + 1})`] = cells[i] ?? '';
  const errors: RowProblem[] = [];
  const bad = (column: string, reason: string): void => void errors.push({ row: r, column, reason });
  for (const e of rec.errors) bad('(row)', `${lineRange(...rec.lines)}: ${e}`);
  for (const d of dupProblems) bad('(header)', d);
  for (const m of missing) bad(m, 'the header has no such column (required)');
  if (cells.length !== header.length) bad('(row)', `${lineRange(...rec.lines)} has ${cells.length} cells but the header has ${header.length}`);
  const num: Partial<Record<NumericColumn, number>> = {};
  for (const c of NUMERIC) {
    if (raw[c] === undefined) continue;
    const p = parseNumberCell(raw[c]);
    if (p.reason) bad(c, p.reason);
    else if (p.value !== undefined) num[c] = p.value;
  }
  const id = (raw.id ?? '').trim();
  if (!id) bad('id', 'is empty');
  else if (earlierRow !== undefined) bad('id', `"${id}" repeats row ${earlierRow}`);
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
  if (errors.length) return { row: r, lines: rec.lines, lineEnd: rec.lineEnd, raw, status: 'rejected', errors };
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
  return { row: r, lines: rec.lines, lineEnd: rec.lineEnd, raw, status: 'ok', galaxy, errors: [] };
}

/** Warnings about the file's line ends (mixed) and empty lines, from every record's line end. */
function lineWarnings(ends: Map<LineEnd, number[]>, empty: readonly number[]): string[] {
  const out: string[] = [];
  if (ends.size > 1) out.push(`line ends are mixed (${[...ends].map(([k, v]) => `${k} on ${v.length === 1 ? 'line' : 'lines'} ${listLines(v)}`).join('; ')}); every line was read`);
  if (empty.length) out.push(`${empty.length === 1 ? 'line' : 'lines'} ${listLines(empty)} ${empty.length === 1 ? 'is' : 'are'} empty and ${empty.length === 1 ? 'was' : 'were'} skipped`);
  return out;
}

/** What the audit needs to know of the sample's accepted rows before auditing any (the ceiling tables' reach, the CSV layout). */
export interface SampleSummary {
  readonly accepted: number;
  /** Lowest and highest z of the accepted rows (±Infinity when none). */
  readonly zLowest: number;
  readonly zHighest: number;
  /** The highest redshift the draws of an accepted row may reach: max(z + 5 × the larger half-interval, 1.3 z_alt). */
  readonly zReach: number;
  /** The imf_ref values of the accepted rows, in order of first appearance. */
  readonly imfRefs: readonly string[];
  /** Every column name any row has (the header's, and "(column N)" for cells beyond it), in order of appearance. */
  readonly inputColumns: readonly string[];
}

/** File-level facts of a sample, common to the whole reading and the index. */
export interface SampleFile {
  readonly columns: readonly string[];
  readonly extraColumns: readonly string[];
  /** Problems with the file as a whole (no header, no id/z column, a repeated column, an unclosed quote, …). */
  readonly fileErrors: readonly string[];
  /** Things worth knowing that cost no data (a column name close to one of ours, mixed line ends). */
  readonly fileWarnings: readonly string[];
  /** Physical lines: how many, and which were empty (skipped). Header + rows' lines + empty = total. */
  readonly lines: { readonly total: number; readonly header: readonly [number, number]; readonly empty: readonly number[] };
  /** Set when the file cannot be audited at all (no header with id and z): one line saying why. */
  readonly fatal?: string;
  readonly summary: SampleSummary;
}

export interface ParsedSample extends SampleFile {
  readonly rows: readonly SampleRow[];
}

/**
 * The sample read once for its file-level facts and summary, holding only where each record lies
 * (a few numbers a row): `rowAt(i)` reads and checks data row i + 1 again from the text, with the same
 * result as reading the whole file (the memory of an audit stays flat in the number of rows).
 */
export interface SampleIndex extends SampleFile {
  readonly rowCount: number;
  rowAt(i: number): SampleRow;
}

/** Reads the sample for its index; `each` sees every data row as it is read (the whole reading keeps them). */
function readSample(text: string, knownImfs: (name: string) => boolean, each?: (row: SampleRow) => void): SampleIndex {
  const clean = text.replace(/^\uFEFF/, '');
  const dialect: Dialect = { newline: newlineOf(clean) };
  let hf: HeaderFacts | undefined;
  // Per data record: its start and end offsets and its first line (3 numbers, 24 bytes a row).
  let places = new Float64Array(3 * 1024);
  let count = 0;
  const seenIds = new Map<string, number>();
  const repeats = new Map<number, number>();
  const ends = new Map<LineEnd, number[]>();
  let accepted = 0;
  let zLowest = Infinity;
  let zHighest = -Infinity;
  let zReach = -Infinity;
  const imfRefs = new Set<string>();
  const inputColumns = new Set<string>();
  const walked = walkRecords(clean, dialect, (rec, place) => {
    if (rec.lineEnd !== 'none') {
      const l = ends.get(rec.lineEnd);
      if (l) l.push(rec.lines[1]);
      else ends.set(rec.lineEnd, [rec.lines[1]]);
    }
    if (!hf) {
      hf = readHeader(rec);
      for (const h of hf.header) inputColumns.add(h);
      return;
    }
    const r = count + 1;
    if (3 * (count + 1) > places.length) {
      const grown = new Float64Array(places.length * 2);
      grown.set(places);
      places = grown;
    }
    places[3 * count] = place.start;
    places[3 * count + 1] = place.end;
    places[3 * count + 2] = rec.lines[0];
    count++;
    // The id as readRow sees it.
    const id = hf.idColumn >= 0 ? (rec.cells[hf.idColumn] ?? '').trim() : '';
    let earlier: number | undefined;
    if (id) {
      earlier = seenIds.get(id);
      if (earlier === undefined) seenIds.set(id, r);
      else repeats.set(r, earlier);
    }
    const row = readRow(rec, r, hf, earlier, knownImfs);
    for (let i = hf.header.length; i < rec.cells.length; i++) inputColumns.add(`(column ${i + 1})`);
    if (row.status === 'ok') {
      const g = row.galaxy!;
      accepted++;
      zLowest = Math.min(zLowest, g.z);
      zHighest = Math.max(zHighest, g.z);
      const spread = Math.max(g.zHi !== undefined ? g.zHi - g.z : 0, g.z - (g.zLo ?? g.z));
      zReach = Math.max(zReach, g.z + 5 * spread, (g.zAlt ?? 0) * 1.3);
      if (g.imfRef) imfRefs.add(g.imfRef);
    }
    each?.(row);
  });
  dialect.delimiter = walked.delimiter;
  const { empty, total } = walked;
  const summary: SampleSummary = { accepted, zLowest, zHighest, zReach, imfRefs: [...imfRefs], inputColumns: [...inputColumns] };
  if (!hf) {
    const fatal = 'the sample is empty (no header row)';
    return { columns: [], extraColumns: [], fileErrors: [fatal], fileWarnings: [], lines: { total, header: [0, 0], empty }, fatal, summary, rowCount: 0, rowAt: noRow };
  }
  const facts = hf;
  const fileWarnings = [...facts.fileWarnings, ...lineWarnings(ends, empty)];
  seenIds.clear(); // rowAt's closure shares this scope: let the ids go
  const rowAt = (i: number): SampleRow => {
    if (!(i >= 0 && i < count)) return noRow(i);
    const start = places[3 * i];
    const end = places[3 * i + 1];
    const first = places[3 * i + 2];
    let row: SampleRow | undefined;
    walkRecords(clean.slice(start, end), dialect, (rec) => {
      row = readRow(rec, i + 1, facts, repeats.get(i + 1), knownImfs);
      return false;
    }, first);
    return row!;
  };
  return {
    columns: facts.header,
    extraColumns: facts.extra,
    fileErrors: facts.fileErrors,
    fileWarnings,
    lines: { total, header: facts.lines, empty },
    ...(facts.fatal ? { fatal: facts.fatal } : {}),
    summary,
    rowCount: count,
    rowAt,
  };
}

function noRow(i: number): never {
  throw new RangeError(`the sample has no data row ${i + 1}`);
}

/** The sample read for the audit: file-level facts, summary and an index of its rows (see SampleIndex). */
export function indexSample(text: string, knownImfs: (name: string) => boolean): SampleIndex {
  return readSample(text, knownImfs);
}

/** The sample read whole: every row kept (for the page's editor and for tests). */
export function parseSample(text: string, knownImfs: (name: string) => boolean): ParsedSample {
  const rows: SampleRow[] = [];
  const { rowCount: _n, rowAt: _r, ...file } = readSample(text, knownImfs, (row) => rows.push(row));
  return { ...file, rows };
}
