import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main, type LineOut } from '../../src/cli/main.js';
import { auditMarkdown, type AuditResult } from '../../src/core/audit/index.js';

/**
 * The CLI writes the Markdown summary as the rows come (head, a paragraph per galaxy, the sample level),
 * so that a large sample's report is not held whole. Written in pieces through `write`, or in one call
 * without it, it must be exactly the report built from the whole result (the same run's JSON). Invented
 * rows: a file warning (an empty line), a rejected row, a repeated id, Markdown and formula characters.
 */
const file = join(mkdtempSync(join(tmpdir(), 'baryon-md-')), 'sample.csv');
writeFileSync(file, 'id,z,muv,notes\nMS-1,9.5,-21,"*bold* | pipe"\n\nMS-2,abc,-20,\nMS-1,8,-20.5,=1+1\nMS-3,10.2,-22.1,\n');
const args = (fmt: string) => ['assess', file, '--area-arcmin2', '40', '--z-range', '7:11', '--imf', 'salpeter,top-heavy-flat', '--draws', '300', '--format', fmt];

async function cli(fmt: string, withWrite: boolean): Promise<{ code: number; text: string; writes: number }> {
  let text = '';
  let writes = 0;
  const lines = (s: string): void => void (text += s + '\n');
  const out: LineOut = withWrite ? Object.assign(lines, { write: (s: string) => void ((text += s), writes++) }) : lines;
  const code = await main(args(fmt), out, () => undefined);
  return { code, text, writes };
}

describe('Markdown written as the rows come', () => {
  it("equals the whole report built from the same run's JSON (plus the final line break), with and without piecewise writes", async () => {
    const json = await cli('json', false);
    expect(json.code).toBe(0);
    const whole = auditMarkdown(JSON.parse(json.text) as AuditResult);
    expect(whole).toContain('## The sample file');
    expect(whole).toContain('not audited');
    for (const w of [true, false]) {
      const r = await cli('md', w);
      expect(r.code).toBe(0);
      expect(r.text).toBe(whole + '\n');
      if (w) expect(r.writes).toBeGreaterThan(0);
    }
  });
});
