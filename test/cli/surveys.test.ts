import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from './run-cli.js';

const run = runCli;
const tmp = mkdtempSync(join(tmpdir(), 'baryon-surveys-'));
const sample = join(tmp, 's.csv');
writeFileSync(sample, 'id,z,muv,survey\nQ-1,9,-21,deep\nQ-2,9,-21,\n');
const base = ['assess', sample, '--area-arcmin2', '40', '--z-range', '7:11', '--draws', '200', '--imf', 'salpeter'];

/** UTF-16 little-endian with a byte-order mark. */
function utf16le(text: string): Buffer {
  const b = Buffer.alloc(2 + 2 * text.length);
  b[0] = 0xff;
  b[1] = 0xfe;
  for (let i = 0; i < text.length; i++) b.writeUInt16LE(text.charCodeAt(i), 2 + 2 * i);
  return b;
}

describe('assess --surveys', () => {
  it('a bad surveys file exits 2 with every problem named by line and column, on one line', async () => {
    const f = join(tmp, 'bad.csv');
    writeFileSync(f, 'name,area_arcmin2,z_min,z_max\ndeep,"1,5",8,12\nwide,10,6\n');
    const r = await run([...base, '--surveys', f]);
    expect(r.code).toBe(2);
    expect(r.err.trim().split('\n')).toHaveLength(1);
    expect(r.err).toMatch(/--surveys .*bad\.csv: 2 problems: surveys file, line 2, column area_arcmin2: .*comma.*; surveys file, line 3: 3 cells, but the header has 4/);
  });

  it('a UTF-16 surveys file with CRLF is read, its survey used by the row naming it, and unknown columns noted', async () => {
    const f = join(tmp, 'u16.csv');
    writeFileSync(f, utf16le('NAME,Area_arcmin2,z_min,z_max,remark\r\ndeep,2,8,10,x\r\n'));
    const r = await run([...base, '--surveys', f]);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/note: --surveys .*column "remark" is not one of/);
    const j = JSON.parse(r.out);
    expect(j.galaxies.map((g: { status: string; survey: string }) => [g.status, g.survey])).toEqual([['ok', 'deep'], ['ok', 'survey']]);
    // Same galaxy, smaller field (2 against 40 arcmin²): a lower ceiling, so a higher required ε (extreme-value statistics).
    const [deep, wide] = j.galaxies.map((g: { imf: { salpeter: { eps_required_median: number } } }) => g.imf.salpeter.eps_required_median);
    expect(deep).toBeGreaterThan(wide);
    // The sample's densities are those of the default survey's volume: a galaxy of a named survey is
    // audited against its own field but is not counted in them (README, "Sample level").
    expect(j.sample.bins[0].galaxies).toBe(1);
    expect(j.sample.bins[0].points.map((p: { id: string }) => p.id)).toEqual(['Q-2']);
  });
});
