import {
  auditCsvFileRows,
  auditCsvHeader,
  auditCsvRow,
  auditRecord,
  AUDIT_CAUTION,
  csvLayoutOf,
  markdownGalaxy,
  markdownHead,
  markdownTail,
  newTally,
  prepareAudit,
  sampleLevel,
  tallyRow,
  type AuditChoices,
  type GalaxyRow,
  type PreparedAudit,
} from '../core/audit/index.js';
import { once } from 'node:events';
import { CliError } from './cli-error.js';
import { assertFinite } from './output.js';
import { auditRowsInOrder } from './parallel-audit.js';
import { jsonPieces } from './json-pieces.js';
import type { LineOut } from './main.js';

/**
 * Waits while stdout holds more than 4 MB not yet written (a pipe or /dev/null is written
 * asynchronously; without this the whole output would queue in memory).
 */
async function backpressure(): Promise<void> {
  if (process.stdout.writableLength > 4 << 20) await once(process.stdout, 'drain');
}


/**
 * Writes pieces that together make whole lines (a line break follows the last): with `out.write`
 * (standard output) as they come, gathered to 64 kB; otherwise joined into one `out` call.
 */
async function writePieces(pieces: Iterable<string> | AsyncIterable<string>, out: LineOut): Promise<void> {
  const write = out.write;
  if (!write) {
    const whole: string[] = [];
    for await (const p of pieces) whole.push(p);
    out(whole.join(''));
    return;
  }
  let buf = '';
  for await (const p of pieces) {
    buf += p;
    if (buf.length > 1 << 16) {
      write(buf);
      buf = '';
      await backpressure();
    }
  }
  write(buf + '\n');
}

/** The Markdown summary as the rows come: the head, one paragraph per galaxy, then the sample level from the tally. */
async function* markdownPieces(prep: PreparedAudit, rows: AsyncIterable<GalaxyRow>): AsyncGenerator<string> {
  const c = prep.choices;
  const tally = newTally(prep);
  yield markdownHead(c, prep.parsed.fileErrors, prep.parsed.fileWarnings);
  for await (const g of rows) {
    yield markdownGalaxy(g, c);
    tallyRow(prep, tally, g);
  }
  yield markdownTail(sampleLevel(prep, tally), c, AUDIT_CAUTION);
}

/**
 * Runs the audit and writes it through `out` as it goes: JSON and CSV one galaxy per line, the
 * sample level and the record at the end; Markdown head, one paragraph per galaxy, then the sample level. No
 * row is kept: the sample is indexed (core/audit/sample.ts), each row read again when audited, and
 * the sample level keeps only its members' masses (SampleTally), so memory stays flat in the rows.
 * A sample without a usable header is a CliError (exit 2); bad choices a RangeError (exit 2).
 */
export async function streamAudit(csv: string, choices: AuditChoices, jobs: number, entry: URL, fmt: 'json' | 'csv' | 'md', out: LineOut): Promise<void> {
  const prep = prepareAudit(csv, choices);
  const parsed = prep.parsed;
  if (parsed.fatal) throw new CliError(`sample: ${parsed.fatal}`);
  const rows = auditRowsInOrder(prep, jobs, entry);
  if (fmt === 'md') {
    await writePieces(markdownPieces(prep, rows), out); // auditMarkdown's text, then a line break
    return;
  }
  if (fmt === 'csv') {
    const layout = csvLayoutOf(prep.choices.imfs, parsed.summary.imfRefs, [...parsed.columns, ...parsed.summary.inputColumns]);
    out(auditCsvHeader(layout));
    for (const l of auditCsvFileRows(layout, parsed.fileErrors, parsed.fileWarnings)) out(l);
    for await (const g of rows) {
      out(auditCsvRow(g, layout));
      await backpressure();
    }
    return;
  }
  const tally = newTally(prep);
  out('{\n  "galaxies": [');
  // Each galaxy on its own line; a line is written when the next one arrives (it then needs its comma).
  let pending: string | undefined;
  let n = 0;
  for await (const g of rows) {
    assertFinite(g, `$.galaxies[${n++}]`);
    if (pending !== undefined) out(pending + ',');
    pending = `    ${JSON.stringify(g)}`;
    tallyRow(prep, tally, g);
    await backpressure();
  }
  if (pending !== undefined) out(pending);
  const sample = sampleLevel(prep, tally);
  assertFinite(sample, '$.sample');
  const record = auditRecord(prep);
  await writePieces(
    (function* () {
      yield '  ],\n  "sample": ';
      yield* jsonPieces(sample, '  ');
      yield `,\n  "caution": ${JSON.stringify(AUDIT_CAUTION)},\n  "record": `;
      yield* jsonPieces(record, '  ');
      yield '\n}';
    })(),
    out,
  );
}
