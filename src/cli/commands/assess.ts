import {
  auditCsv,
  auditMarkdown,
  checkChoices,
  DEFAULT_IMFS,
  imfProblem,
  normalizeChoices,
  parseSurveys,
  specByKey,
  SURVEY_SPECS,
  validateRecord,
  reproduction,
  type AuditChoices,
  type ChoiceSpec,
  type Survey,
} from '../../core/audit/index.js';
import { disputedMap } from '../../core/audit/disputed-map.js';
import { prepareAudit } from '../../core/audit/run-audit.js';
import { toCsv, toJson } from '../output.js';
import { DEMO_SAMPLE_CSV, DEMO_SURVEY } from '../../demo/demo-sample.js';
import { COSMOLOGY_HELP, COSMOLOGY_OPTIONS, cosmologyFrom, format, num, parse } from '../args.js';
import { CliError } from '../cli-error.js';
import { CHOICE_HELP, CHOICE_OPTIONS, flagOfField, numericChoices, specFlag, switchChoices } from '../choice-flags.js';
import { parseCovarianceCsv, type ParamCovariance } from '../../core/cosmology/index.js';
import { HALO_HELP, HALO_OPTIONS, haloChoices } from '../halo-options.js';
import { defaultJobs, maxJobs } from '../parallel-audit.js';
import { INPUT_OPTIONS, inputLimitBytes, readInput } from '../read-input.js';
import { streamAudit } from '../stream-audit.js';
import type { LineOut } from '../main.js';
import { imfList, sfhFrom, STAR_HELP, STAR_OPTIONS } from '../star-options.js';

export const ASSESS_HELP = `Usage: assess SAMPLE.csv --area-arcmin2 40 --z-range 7:11 [--imf ...] [--eps-ref 0.3] [--quantile 0.997]
              [--draws 20000] [--fixed-draws] [--seed 1] [--format json|csv|md]
       assess --demo [--format md]            the embedded invented demo field and sample
       assess --record RECORD.json            re-run a saved record (reproduces its numbers exactly)
For every galaxy: the stellar mass under each IMF (Monte Carlo over redshift, errors and ages),
the efficiency ε needed against the baryons of the rarest halo in its redshift slice, verdicts
(within budget / strained / over budget) and what drives a tension; for the sample, cumulative
stellar densities against the ΛCDM limits. Rejected rows stay in the output with their reasons.

Survey and choices:
  --area-arcmin2 A     survey area [arcmin^2]
  --z-range A:B        survey redshift range
  --survey-name NAME   name of the default survey (default "survey")
  --surveys FILE       CSV of named surveys (name,area_arcmin2,z_min,z_max) for the sample's survey column
  --headline-imf NAME  the IMF of the headline verdict for rows without imf_ref (default: the first
                       --imf; always compared)
  --map ID             instead of the audit, the map of galaxy ID: median ε_req over redshift × IMF slope
                       (custom:0.1:1.3:0.5:α:100) with the ε = 1 and ε_ref contours (json or csv)
  --cosmo-cov FILE     covariance of ω_b, ω_c, H0, n_s, σ8 for the ceiling's spread (CSV, header
                       param,omega_b_h2,omega_c_h2,h0,n_s,sigma8; default: the preset's 1σ errors)
${CHOICE_HELP}
  --z-bins A:B,C:D     redshift bins for the sample densities (default: the survey range)
  --jobs N             worker threads for large samples (default: cores, for ≥ 24 rows; capped at the
                       available cores; same numbers as 1)
  (--max-input-mb: see below)

${STAR_HELP}

${HALO_HELP}

${COSMOLOGY_HELP}`;

/**
 * `--map ID`: the map of one galaxy (median ε_req over redshift × high-mass IMF slope, with the ε = 1 and
 * ε_ref contours), the data of the page's fifth figure: JSON, or CSV as one row per grid cell.
 */
function mapOf(csv: string, choices: AuditChoices, id: string, fmt: 'json' | 'csv' | 'md'): string {
  const prep = prepareAudit(csv, choices);
  let index = -1;
  for (let i = 0; i < prep.parsed.rowCount && index < 0; i++) if ((prep.parsed.rowAt(i).raw.id ?? '').trim() === id) index = i;
  if (index < 0) throw new CliError(`--map: no row has the id "${id}"`);
  const r = prep.parsed.rowAt(index);
  if (r.status !== 'ok') throw new CliError(`--map: row ${r.row} ("${id}") is rejected: ${r.errors.map((e) => `${e.column}: ${e.reason}`).join('; ')}`);
  let m;
  try {
    m = disputedMap(prep, index);
  } catch (e) {
    throw new CliError(`--map ${id}: ${(e as Error).message}`);
  }
  if (fmt === 'md') throw new CliError('--map gives json or csv');
  if (fmt === 'csv') return toCsv(m.slope.flatMap((a, j) => m.z.map((z, i) => ({ z, imf_slope: a, log10_eps_required: m.log10_eps_required[j][i] }))));
  return toJson(m);
}

const AREA = specByKey(SURVEY_SPECS, 'areaArcmin2');
const Z_MIN = specByKey(SURVEY_SPECS, 'zMin');
const Z_MAX = specByKey(SURVEY_SPECS, 'zMax');

/** `A:B` checked against two specs (the survey range, or a redshift bin). */
function range(flag: string, raw: string, lo: ChoiceSpec, hi: ChoiceSpec): [number, number] {
  const parts = raw.split(':');
  if (parts.length !== 2) throw new CliError(`${flag}: "${raw}" must be A:B`);
  const a = specFlag(lo, parts[0], flag);
  const b = specFlag(hi, parts[1], flag);
  if (!(b > a)) throw new CliError(`${flag}: need A < B (got ${raw})`);
  return [a, b];
}

/** Flags that only make sense for a new audit; beside --record they are refused, not ignored. */
const RECORD_ALLOWS = new Set(['record', 'format', 'jobs', 'help', 'max-input-mb']);

export async function runAssess(argv: string[], out: LineOut = () => undefined, err: (s: string) => void = () => undefined): Promise<string | undefined> {
  const { values, positionals } = parse(
    argv,
    {
      demo: { type: 'boolean' },
      record: { type: 'string' },
      'area-arcmin2': { type: 'string' },
      'z-range': { type: 'string' },
      'survey-name': { type: 'string' },
      surveys: { type: 'string' },
      'headline-imf': { type: 'string' },
      'cosmo-cov': { type: 'string' },
      map: { type: 'string' },
      ...CHOICE_OPTIONS,
      'z-bins': { type: 'string' },
      jobs: { type: 'string' },
      ...INPUT_OPTIONS,
      ...STAR_OPTIONS,
      ...HALO_OPTIONS,
      ...COSMOLOGY_OPTIONS,
    },
    true,
  );
  if (values.help) return ASSESS_HELP;
  const fmt = format(values, ['json', 'csv', 'md']) as 'json' | 'csv' | 'md';
  const limit = inputLimitBytes(values);
  let csv: string;
  let choices: AuditChoices;
  if (typeof values.record === 'string') {
    const beside = Object.keys(values).filter((k) => values[k] !== undefined && !RECORD_ALLOWS.has(k));
    if (beside.length || positionals.length) {
      throw new CliError(`--record re-runs the record's own choices and sample; remove ${[...beside.map((k) => '--' + k), ...positionals].join(', ')} (or run a new audit without --record)`);
    }
    let rec;
    try {
      rec = validateRecord(JSON.parse(readInput(values.record, '--record', limit)));
    } catch (e) {
      if (e instanceof CliError) throw e;
      throw new CliError(`--record ${values.record}: ${(e as Error).message}`);
    }
    // --record promises the record's numbers exactly: a record this version would compute differently is refused
    const rep = reproduction(rec);
    if (!rep.exact) throw new CliError(`--record ${values.record}: ${rep.reason}. Re-run it with that version for its exact numbers`);
    csv = rec.sample_csv;
    choices = rec.choices;
  } else {
    if (positionals.length > 1) throw new CliError(`give one sample file (got ${positionals.length})`);
    const demo = values.demo === true;
    if (!demo && positionals.length === 0) throw new CliError('give a sample file (SAMPLE.csv), --demo or --record FILE');
    csv = demo ? DEMO_SAMPLE_CSV : readInput(positionals[0], 'sample', limit);
    let survey: Survey;
    if (demo && values['area-arcmin2'] === undefined && values['z-range'] === undefined) survey = DEMO_SURVEY;
    else {
      if (values['area-arcmin2'] === undefined) throw new CliError('--area-arcmin2 is required (survey area in arcmin^2)');
      if (values['z-range'] === undefined) throw new CliError('--z-range A:B is required (survey redshift range)');
      const [zMin, zMax] = range('--z-range', String(values['z-range']), Z_MIN, Z_MAX);
      const name = typeof values['survey-name'] === 'string' ? values['survey-name'].trim() : 'survey';
      if (!name) throw new CliError('--survey-name: the name is empty');
      survey = { name, areaArcmin2: specFlag(AREA, values['area-arcmin2']), zMin, zMax };
    }
    let surveys: Survey[] = [];
    if (typeof values.surveys === 'string') {
      const parsed = parseSurveys(readInput(values.surveys, '--surveys', limit));
      if (parsed.errors.length) {
        const shown = parsed.errors.slice(0, 10).join('; ');
        throw new CliError(`--surveys ${values.surveys}: ${parsed.errors.length} ${parsed.errors.length === 1 ? 'problem' : 'problems'}: ${shown}${parsed.errors.length > 10 ? `; and ${parsed.errors.length - 10} more` : ''}`);
      }
      for (const w of parsed.warnings) err(`note: --surveys ${values.surveys}: ${w}`);
      surveys = parsed.surveys;
    }
    const halo = haloChoices(values);
    let cosmologyCovariance: ParamCovariance | undefined;
    if (typeof values['cosmo-cov'] === 'string') {
      try {
        cosmologyCovariance = parseCovarianceCsv(readInput(values['cosmo-cov'], '--cosmo-cov', limit), values['cosmo-cov']);
      } catch (e) {
        if (e instanceof CliError) throw e;
        throw new CliError(`--cosmo-cov ${values['cosmo-cov']}: ${(e as Error).message}`);
      }
    }
    sfhFrom(values);
    const imfs = imfList(values, DEFAULT_IMFS);
    let headlineImf: string | undefined;
    if (values['headline-imf'] !== undefined) {
      headlineImf = String(values['headline-imf']).trim();
      const p = imfProblem(headlineImf);
      if (p) throw new CliError(`--headline-imf: ${p}`);
    }
    choices = normalizeChoices({
      cosmology: cosmologyFrom(values),
      massFunction: halo.massFunction,
      transfer: halo.transfer,
      deltaC: halo.deltaC,
      ...(halo.growth !== undefined ? { growth: halo.growth } : {}),
      ...(cosmologyCovariance !== undefined ? { cosmologyCovariance } : {}),
      imfs,
      ...(headlineImf !== undefined ? { headlineImf } : {}),
      sfh: typeof values.sfh === 'string' ? values.sfh : 'constant',
      ...numericChoices(values),
      ...switchChoices(values),
      survey,
      surveys,
      zBins: typeof values['z-bins'] === 'string' ? String(values['z-bins']).split(',').map((b) => range('--z-bins', b, Z_MIN, Z_MAX)) : [],
    });
    const problems = checkChoices(choices);
    if (problems.length) {
      const p = problems[0];
      const flag = flagOfField(p.field);
      throw new CliError(`${flag ? flag + ' ' : ''}(${p.field}) ${p.reason}`);
    }
  }
  let rowsGuess = 0;
  for (let i = csv.indexOf('\n'); i >= 0; i = csv.indexOf('\n', i + 1)) rowsGuess++;
  let jobs = values.jobs === undefined ? defaultJobs(rowsGuess) : num('jobs', values.jobs, { min: 1, max: 1024 });
  if (!Number.isInteger(jobs)) throw new CliError(`--jobs must be a whole number (got ${values.jobs})`);
  if (jobs > maxJobs()) {
    err(`note: --jobs ${jobs} capped at ${maxJobs()}, the cores available to this process (more threads than cores only slow the audit down)`);
    jobs = maxJobs();
  }
  if (typeof values.map === 'string') return mapOf(csv, choices, values.map.trim(), fmt);
  await streamAudit(csv, choices, jobs, new URL(import.meta.url), fmt, out);
  return undefined;
}
