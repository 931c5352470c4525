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
async function writePieces(pieces: Iterable<string>, out: LineOut): Promise<void> {
  const write = out.write;
  if (!write) {
    out([...pieces].join(''));
    return;
  }
  let buf = '';
  for (const p of pieces) {
    buf += p;
    if (buf.length > 1 << 16) {
      write(buf);
      buf = '';
      await backpressure();
    }
  }
  write(buf + '\n');
}

/**
 * The Markdown summary as the rows come: the head, one paragraph per galaxy, then the sample level
 * from the tally. With `out.write` the text goes out in pieces of about 64 kB; otherwise it is one
 * `out` call. Either way the text is auditMarkdown's, followed by a line break.
 */
async function streamMarkdown(prep: PreparedAudit, rows: AsyncIterable<GalaxyRow>, out: LineOut): Promise<void> {
  const c = prep.choices;
  const write = out.write;
  const whole: string[] = [];
  let buf = '';
  const put = async (text: string): Promise<void> => {
    if (!write) return void whole.push(text);
    buf += text;
    if (buf.length > 1 << 16) {
      write(buf);
      buf = '';
      await backpressure();
    }
  };
  const tally = newTally(prep);
  await put(markdownHead(c, prep.parsed.fileErrors, prep.parsed.fileWarnings));
  for await (const g of rows) {
    await put(markdownGalaxy(g, c));
    tallyRow(prep, tally, g);
  }
  await put(markdownTail(sampleLevel(prep, tally), c, AUDIT_CAUTION));
  if (write) write(buf + '\n');
  else out(whole.join(''));
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
    await streamMarkdown(prep, rows, out);
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
