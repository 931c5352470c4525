import {
  auditCsvFileRows,
  auditCsvHeader,
  auditCsvRow,
  auditMarkdown,
  csvLayoutOf,
  finishAudit,
  prepareAudit,
  type AuditChoices,
  type GalaxyRow,
} from '../core/audit/index.js';
import { once } from 'node:events';
import { CliError } from './cli-error.js';
import { assertFinite } from './output.js';
import { auditRowsInOrder } from './parallel-audit.js';

/**
 * What the sample level needs of a galaxy (finishAudit reads its status, survey, z and headline
 * masses); the rest of each row is written out and dropped, so memory stays small per row.
 */
function slim(g: GalaxyRow): GalaxyRow {
  const h = g.headline_imf;
  return {
    row: g.row,
    lines: g.lines,
    line_end: g.line_end,
    id: g.id,
    status: g.status,
    errors: [],
    survey: g.survey,
    input: { z: g.input.z ?? '' },
    ...(h && g.imf ? { headline_imf: h, imf: { [h]: g.imf[h] } } : {}),
  } as GalaxyRow;
}

/**
 * Waits while stdout holds more than 4 MB not yet written (a pipe or /dev/null is written
 * asynchronously; without this the whole output would queue in memory).
 */
async function backpressure(): Promise<void> {
  if (process.stdout.writableLength > 4 << 20) await once(process.stdout, 'drain');
}

const indent = (json: string, pad: string): string => json.replace(/\n/g, `\n${pad}`);

/**
 * Runs the audit and writes it through `out` as it goes: JSON and CSV one galaxy per line, the
 * sample level and the record at the end (Markdown, a report for people, is written whole).
 * A sample without a usable header is a CliError (exit 2); bad choices a RangeError (exit 2).
 */
export async function streamAudit(csv: string, choices: AuditChoices, jobs: number, entry: URL, fmt: 'json' | 'csv' | 'md', out: (s: string) => void): Promise<void> {
  const prep = prepareAudit(csv, choices);
  const parsed = prep.parsed;
  if (parsed.fatal) throw new CliError(`sample: ${parsed.fatal}`);
  const kept: GalaxyRow[] = [];
  const rows = auditRowsInOrder(prep, jobs, entry);
  if (fmt === 'md') {
    for await (const g of rows) kept.push(g);
    out(auditMarkdown(finishAudit(prep, kept)));
    return;
  }
  if (fmt === 'csv') {
    const refs = new Set<string>();
    const inputs = new Set<string>(parsed.columns);
    for (const r of parsed.rows) {
      if (r.galaxy?.imfRef) refs.add(r.galaxy.imfRef);
      for (const k of Object.keys(r.raw)) inputs.add(k);
    }
    const layout = csvLayoutOf(prep.choices.imfs, refs, inputs);
    out(auditCsvHeader(layout));
    for (const l of auditCsvFileRows(layout, parsed.fileErrors, parsed.fileWarnings)) out(l);
    for await (const g of rows) {
      out(auditCsvRow(g, layout));
      kept.push(slim(g));
      await backpressure();
    }
    finishAudit(prep, kept);
    return;
  }
  out('{\n  "galaxies": [');
  // Each galaxy on its own line; a line is written when the next one arrives (it then needs its comma).
  let pending: string | undefined;
  for await (const g of rows) {
    assertFinite(g, `$.galaxies[${kept.length}]`);
    if (pending !== undefined) out(pending + ',');
    pending = `    ${JSON.stringify(g)}`;
    kept.push(slim(g));
    await backpressure();
  }
  if (pending !== undefined) out(pending);
  const res = finishAudit(prep, kept);
  assertFinite(res.sample, '$.sample');
  out(`  ],\n  "sample": ${indent(JSON.stringify(res.sample, null, 2), '  ')},\n  "caution": ${JSON.stringify(res.caution)},\n  "record": ${indent(JSON.stringify(res.record, null, 2), '  ')}\n}`);
}
