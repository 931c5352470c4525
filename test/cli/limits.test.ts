import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from './run-cli.js';

const run = runCli;
const tmp = mkdtempSync(join(tmpdir(), 'baryon-limits-'));

describe('bounded resources', () => {
  it('an endless input (/dev/zero) as sample, record or P(k) table stops at the input limit with exit 2', async () => {
    for (const args of [
      ['assess', '/dev/zero', '--area-arcmin2', '40', '--z-range', '7:11'],
      ['assess', '--record', '/dev/zero'],
      ['assess', '--demo', '--pk-file', '/dev/zero'],
      ['halos', '--z', '8', '--mass', '1e10:1e12:3', '--pk-file', '/dev/zero'],
    ]) {
      const r = await run([...args, '--max-input-mb', '2']);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.err).toMatch(/\/dev\/zero is larger than the input limit of 2 MB; raise it with --max-input-mb/);
      expect(r.err.trim().split('\n')).toHaveLength(1);
    }
  });

  it('a file above the limit is refused; raising the limit reads it', async () => {
    const f = join(tmp, 's.csv');
    writeFileSync(f, 'id,z,muv,notes\nA,9,-20,' + 'x'.repeat(3000) + '\n');
    const base = ['assess', f, '--area-arcmin2', '40', '--z-range', '7:11', '--draws', '100', '--imf', 'salpeter'];
    expect((await run([...base, '--max-input-mb', '0.001'])).err).toMatch(/larger than the input limit of 0\.001 MB/);
    expect((await run([...base, '--max-input-mb', '0.01'])).code).toBe(0);
  });

  it('a sample without a header, or without id or z, exits 2 with one line saying so', async () => {
    for (const [text, re] of [
      ['A,9,-20\nB,9,-20\n', /first line must be a header/],
      ['name,redshift,muv\nA,9,-20\n', /no "id" or "z" column/],
      ['', /empty/],
    ] as const) {
      const f = join(tmp, 'h.csv');
      writeFileSync(f, text);
      const r = await run(['assess', f, '--area-arcmin2', '40', '--z-range', '7:11']);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(re);
      expect(r.err.trim().split('\n')).toHaveLength(1);
    }
  });

  it('UTF-16 samples with a BOM are read; invalid UTF-8 is refused naming the encoding', async () => {
    const f = join(tmp, 'u16.csv');
    writeFileSync(f, Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('id,z,muv\nA,9,-20\n', 'utf16le')]));
    const r = await run(['assess', f, '--area-arcmin2', '40', '--z-range', '7:11', '--draws', '100', '--imf', 'salpeter']);
    expect(r.code, r.err).toBe(0);
    expect(JSON.parse(r.out).galaxies[0]).toMatchObject({ id: 'A', status: 'ok' });
    writeFileSync(f, Buffer.from([0x69, 0x64, 0x2c, 0x7a, 0x0a, 0xc9, 0x2c, 0x39, 0x0a]));
    const bad = await run(['assess', f, '--area-arcmin2', '40', '--z-range', '7:11']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/^error: sample .* is not valid UTF-8 \(byte 0xc9 at offset 5, line 2\)/);
  });

  it('--jobs above the available cores is capped there, with a note, and gives the serial numbers', () => {
    const f = join(tmp, 'many.csv');
    const lines = ['id,z,z_lo,z_hi,muv,mag_err'];
    for (let i = 0; i < 40; i++) lines.push(`J-${i},${(7.5 + i * 0.08).toFixed(2)},${(7.3 + i * 0.08).toFixed(2)},${(7.7 + i * 0.08).toFixed(2)},-20.5,0.1`);
    writeFileSync(f, lines.join('\n'));
    const base = ['src/cli/launch.mjs', 'assess', f, '--area-arcmin2', '40', '--z-range', '7:11', '--draws', '200', '--imf', 'salpeter'];
    const serial = spawnSync(process.execPath, [...base, '--jobs', '1'], { encoding: 'utf8' });
    const many = spawnSync(process.execPath, [...base, '--jobs', '64'], { encoding: 'utf8' });
    expect(many.status, many.stderr).toBe(0);
    expect(many.stderr).toMatch(new RegExp(`note: --jobs 64 capped at ${availableParallelism()}`));
    expect(JSON.parse(many.stdout).galaxies).toEqual(JSON.parse(serial.stdout).galaxies);
  }, 120000);

  it('the streamed JSON and CSV are the same documents the core writes in one piece', async () => {
    const { auditCsv, runAudit, normalizeChoices } = await import('../../src/core/audit/index.js');
    const f = join(tmp, 'st.csv');
    writeFileSync(f, 'id,z,muv,notes,extra,imf_ref,log_mstar\nA,9,-20,=x,1,,\nB,nine,-20,,2,,\nC,9.5,,,,kroupa,10.2\n');
    const args = ['assess', f, '--area-arcmin2', '40', '--z-range', '7:11', '--draws', '200', '--imf', 'salpeter,chabrier'];
    const json = JSON.parse((await run(args)).out);
    const whole = runAudit(json.record.sample_csv, normalizeChoices(json.record.choices));
    expect(json).toEqual(JSON.parse(JSON.stringify(whole)));
    const csv = (await run([...args, '--format', 'csv'])).out.trimEnd();
    expect(csv).toBe(auditCsv(whole));
  });
});
