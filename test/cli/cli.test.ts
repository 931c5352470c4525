import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from './run-cli.js';

const run = runCli;
const tmp = mkdtempSync(join(tmpdir(), 'baryon-audit-'));

describe('CLI contract', () => {
  it('cosmo --z 0,1,10 gives the documented JSON fields', async () => {
    const r = await run(['cosmo', '--z', '0,1,10']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.cosmology.h0_km_s_mpc).toBe(67.66);
    expect(j.rows).toHaveLength(3);
    expect(Object.keys(j.rows[1])).toEqual(['z', 'age_gyr', 'lookback_gyr', 'comoving_distance_mpc', 'luminosity_distance_mpc', 'angular_diameter_distance_mpc', 'dvdz_mpc3_per_sr']);
  });
  it('halos --mass A:B:N gives N log-spaced masses inclusive, per redshift', async () => {
    const r = await run(['halos', '--z', '0,10', '--mass', '1e8:1e15:29', '--model', 'press-schechter', '--transfer', 'bbks']);
    const j = JSON.parse(r.out);
    expect(j.rows).toHaveLength(58);
    expect(j.rows[0].mass_msun).toBeCloseTo(1e8, -1);
    expect(j.rows[28].mass_msun / 1e15).toBeCloseTo(1, 10);
    expect(Object.keys(j.rows[0])).toEqual(['z', 'mass_msun', 'sigma', 'dndlog10m_mpc3', 'n_above_mpc3', 'rho_above_msun_mpc3']);
  });
  it('rarest gives increasing masses for increasing quantiles over the survey volume', async () => {
    const j = JSON.parse((await run(['rarest', '--z-min', '9', '--z-max', '11', '--area-arcmin2', '40', '--quantiles', '0.5,0.84,0.997'])).out);
    expect(j.volume_mpc3).toBeGreaterThan(0);
    expect(j.quantiles.map((q: { q: number }) => q.q)).toEqual([0.5, 0.84, 0.997]);
    expect(j.quantiles[2].mass_msun).toBeGreaterThan(j.quantiles[0].mass_msun);
  });
  it('stars gives one row per IMF with the documented fields (beta_uv finite); sfr_per_lnu only for constant SFR', async () => {
    const j = JSON.parse((await run(['stars', '--imf', 'salpeter,kroupa,chabrier', '--sfh', 'constant', '--age-myr', '100', '--wavelength-um', '0.15'])).out);
    expect(j.rows.map((r: { imf: string }) => r.imf)).toEqual(['salpeter', 'kroupa', 'chabrier']);
    expect(Object.keys(j.rows[0])).toEqual(['imf', 'sfh', 'age_myr', 'wavelength_um', 'lnu_per_msun_formed', 'surviving_fraction', 'returned_fraction', 'mass_to_light', 'sfr_per_lnu', 'beta_uv']);
    for (const r of j.rows) expect(Number.isFinite(r.beta_uv)).toBe(true);
    const burst = JSON.parse((await run(['stars', '--sfh', 'burst'])).out);
    expect(burst.rows[0].sfr_per_lnu).toBeNull();
  });
  it('stars refuses, with the IMF named, a population whose stars have all died (no Infinity or NaN in M/L and beta_uv)', async () => {
    const r = await run(['stars', '--imf', 'custom:50:2.35:100', '--sfh', 'burst', '--age-myr', '1000']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--imf custom:50:2\.35:100: no light left .*every star has died/);
  });
  it('stars --list-imfs lists every preset with top_heavy and source', async () => {
    const j = JSON.parse((await run(['stars', '--list-imfs', '--format', 'json'])).out);
    expect(j.imfs.filter((i: { top_heavy: boolean }) => i.top_heavy).length).toBeGreaterThanOrEqual(2);
    for (const i of j.imfs) expect(i.source).toMatch(/\d{4}/);
  });
  it('mass echoes the inputs, gives best/min/max per IMF and the caution', async () => {
    const j = JSON.parse((await run(['mass', '--z', '9.1', '--m-ab', '26.2', '--lambda-obs-um', '1.5', '--beta', '-2.0', '--imf', 'salpeter,chabrier', '--sfh', 'constant'])).out);
    expect(j.inputs).toMatchObject({ z: 9.1, m_ab: 26.2, lambda_obs_um: 1.5, beta: -2 });
    expect(j.rows[0].log_mstar_min).toBeLessThanOrEqual(j.rows[0].log_mstar_median_age_prior);
    expect(j.rows[0].log_mstar_median_age_prior).toBeLessThanOrEqual(j.rows[0].log_mstar_max);
    expect(j.caution).toMatch(/depend/);
  });
  it('assess on a sample file gives the documented shape, with rejected rows kept, exit 0', async () => {
    const f = join(tmp, 's.csv');
    writeFileSync(f, 'id,z,muv\nA,9,-20\nB,x,-20\n');
    const r = await run(['assess', f, '--area-arcmin2', '40', '--z-range', '7:11', '--draws', '500', '--imf', 'salpeter,top-heavy-flat']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.galaxies.map((g: { status: string }) => g.status)).toEqual(['ok', 'rejected']);
    expect(Object.keys(j.galaxies[0].imf.salpeter)).toEqual(expect.arrayContaining(['verdict', 'log_mstar_median', 'eps_required_median', 'eps_required_p05', 'p_over_budget', 'p_strained']));
    expect(j.galaxies[1].errors[0]).toMatchObject({ row: 2, column: 'z' });
    expect(j.record.sample_csv).toContain('A,9,-20');
    const rec = join(tmp, 'rec.json');
    writeFileSync(rec, JSON.stringify(j.record));
    const again = JSON.parse((await run(['assess', '--record', rec])).out);
    expect(JSON.stringify(again.galaxies)).toBe(JSON.stringify(j.galaxies));
  });
  it('assess --jobs 2 (worker threads) gives exactly the serial numbers', async () => {
    const f = join(tmp, 'many.csv');
    const lines = ['id,z,z_lo,z_hi,muv,mag_err'];
    for (let i = 0; i < 30; i++) lines.push(`P-${i},${(7.5 + i * 0.1).toFixed(2)},${(7.3 + i * 0.1).toFixed(2)},${(7.7 + i * 0.1).toFixed(2)},-20.5,0.1`);
    writeFileSync(f, lines.join('\n'));
    const base = [f, '--area-arcmin2', '40', '--z-range', '7:11', '--draws', '300', '--imf', 'salpeter,top-heavy-flat'];
    const serial = await run(['assess', ...base, '--jobs', '1']);
    expect(serial.code).toBe(0);
    // worker threads need the bundled CLI: run it through the launcher as a user would
    const { spawnSync } = await import('node:child_process');
    const par = spawnSync(process.execPath, ['src/cli/launch.mjs', 'assess', ...base, '--jobs', '2'], { encoding: 'utf8' });
    expect(par.status).toBe(0);
    expect(JSON.parse(par.stdout).galaxies).toEqual(JSON.parse(serial.out).galaxies);
  }, 120000);
  it('rows the model cannot hold are rejected in every format, never the run, with no NaN', async () => {
    const f = join(tmp, 'edge.csv');
    writeFileSync(f, 'id,z,muv,beta,mag_err,log_mstar,log_mstar_err,imf_ref\nLOW,0.05,-20,,,,,\nDUSTY,9,-25,3.9,0.3,,,\nHEAVY,25,,,,13.9,0.5,salpeter\nOK,9,-20,,,,,\n');
    for (const fmt of ['json', 'csv', 'md']) {
      const r = await run(['assess', f, '--area-arcmin2', '40', '--z-range', '7:11', '--draws', '200', '--format', fmt]);
      expect(r.code, r.err).toBe(0);
      expect(r.out).not.toMatch(/\bNaN\b|Infinity/);
      // null appears only where a reconciliation axis has no answer, and then its reason says why
      if (fmt === 'json') {
        for (const g of JSON.parse(r.out).galaxies) {
          for (const rc of g.reconcile ?? []) for (const [k, v] of Object.entries(rc)) if (v === null) expect(rc.reasons[k]).toBeTruthy();
          expect(JSON.stringify({ ...g, reconcile: [] })).not.toMatch(/null/);
        }
      } else expect(r.out).not.toMatch(/null/);
      if (fmt === 'json') {
        const st = Object.fromEntries(JSON.parse(r.out).galaxies.map((g: { id: string; status: string }) => [g.id, g.status]));
        expect(st).toMatchObject({ LOW: 'rejected', OK: 'ok' });
        expect(Object.keys(st)).toHaveLength(4);
      }
    }
  });
  it('every subcommand answers --help', async () => {
    for (const c of ['cosmo', 'halos', 'rarest', 'stars', 'mass', 'assess']) {
      const r = await run([c, '--help']);
      expect(r.code).toBe(0);
      expect(r.out).toMatch(/Usage:/);
    }
  });
});

describe('CLI errors: exit 2, one line naming the flag, no stack trace, no NaN', () => {
  const cases: [string[], RegExp][] = [
    [['cosmo', '--z', '1,x'], /--z/],
    [['cosmo', '--z', '1', '--omega-b', '0.5', '--omega-m', '0.3'], /--omega-b/],
    [['cosmo', '--z', '1', '--sigma8', '-1'], /--sigma8/],
    [['cosmo', '--z', '1', '--h0', 'NaN'], /--h0/],
    [['cosmo', '--z', '1', '--preset', 'nope'], /--preset/],
    [['halos', '--z', '1', '--mass', '1e8:1e15:x'], /--mass/],
    [['halos', '--z', '1', '--model', 'nope'], /--model/],
    [['rarest', '--z-min', '11', '--z-max', '9', '--area-arcmin2', '40'], /--z-max/],
    [['rarest', '--z-min', '9', '--z-max', '11', '--area-arcmin2', '40', '--quantiles', '1.2'], /--quantiles/],
    [['stars', '--imf', 'nope'], /--imf/],
    [['mass', '--z', '9', '--m-ab', '26', '--lambda-obs-um', '1.0'], /Lyman-α/],
    [['mass', '--z', '9'], /brightness/],
    [['assess', '/nonexistent.csv', '--area-arcmin2', '40', '--z-range', '7:11'], /cannot read/],
    [['assess', '--demo', '--eps-ref', '2'], /--eps-ref/],
    [['assess', '--record', '/nonexistent.json'], /--record/],
    [['assess', '--demo', '--imf', 'custom:0.1:50:100'], /^error: --imf .*above 8 Msun/],
    [['assess', '--demo', '--imf', 'custom:0.1:2.35:0.1000001'], /^error: --imf .*no mass in stars above 8 Msun/],
    [['assess', '--demo', '--area-arcmin2', '5e-324', '--z-range', '7:11'], /^error: --area-arcmin2 \(areaArcmin2\) must be in \[0\.0001/],
    [['assess', '--demo', '--delta-c', '99'], /--delta-c/],
    [['assess', '--demo', '--delta-c', '-1'], /--delta-c/],
    [['stars', '--imf', 'custom:0.1:1e308:100'], /^error: --imf: .*integrals are not finite/],
    [['nope'], /unknown subcommand/],
    [['cosmo', '--bogus', '1'], /bogus/],
  ];
  for (const [args, re] of cases) {
    it(args.join(' '), async () => {
      const r = await run(args);
      expect(r.code).toBe(2);
      expect(r.err.trim().split('\n')).toHaveLength(1);
      expect(r.err).toMatch(re);
      expect(r.err).not.toMatch(/\n\s+at /);
      expect(r.out).not.toMatch(/NaN/);
    });
  }
  it('a tampered record names the field', async () => {
    const f = join(tmp, 'bad.json');
    writeFileSync(f, JSON.stringify({ tool: 'baryon-audit', version: '0.1.0', format: 1, sample_csv: 'id,z\n', choices: { massFunction: 'sheth-tormen' } }));
    const r = await run(['assess', '--record', f]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/record\.choices\.sfh/);
  });
  it('--growth and --cosmo-cov reach the audit and its record, and the record reproduces them exactly', async () => {
    const cov = join(tmp, 'cov.csv');
    // σ8 ± 0.01 alone (variance 1e-4); the others held fixed
    writeFileSync(cov, 'param,omega_b_h2,omega_c_h2,h0,n_s,sigma8\nomega_b_h2,0,0,0,0,0\nomega_c_h2,0,0,0,0,0\nh0,0,0,0,0,0\nn_s,0,0,0,0,0\nsigma8,0,0,0,0,1e-4\n');
    const a = await run(['assess', '--demo', '--draws', '200', '--growth', 'with-radiation', '--cosmo-cov', cov, '--format', 'json']);
    expect(a.code, a.err).toBe(0);
    const j = JSON.parse(a.out);
    expect(j.record.choices.growth).toBe('with-radiation');
    expect(j.record.choices.cosmologyCovariance.matrix[4][4]).toBe(1e-4);
    for (const g of j.galaxies) if (g.status === 'ok') expect(g.ceiling.log_mass_cosmo_sd_dex).toBeGreaterThan(0);
    const f = join(tmp, 'growth-record.json');
    writeFileSync(f, a.out);
    const b = await run(['assess', '--record', f, '--format', 'json']);
    expect(b.code, b.err).toBe(0);
    expect(JSON.parse(b.out).galaxies).toEqual(j.galaxies);
    const bad = await run(['assess', '--demo', '--growth', 'sideways']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--growth/);
  }, 120000);
  it('assess --map ID gives the map of one galaxy (the fifth figure’s data) in JSON and CSV; an unknown id exits 2', async () => {
    const j = await run(['assess', '--demo', '--draws', '300', '--map', 'QF-322', '--format', 'json']);
    expect(j.code, j.err).toBe(0);
    const m = JSON.parse(j.out);
    expect(m.id).toBe('QF-322');
    expect(m.log10_eps_required).toHaveLength(m.slope.length);
    expect(m.contours.map((c: { eps: number }) => c.eps)).toEqual([1, 0.3]);
    const c = await run(['assess', '--demo', '--draws', '300', '--map', 'QF-322', '--format', 'csv']);
    expect(c.out.trim().split('\n')).toHaveLength(1 + m.z.length * m.slope.length);
    const bad = await run(['assess', '--demo', '--map', 'NOPE']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/no row has the id "NOPE"/);
  }, 120000);
});
