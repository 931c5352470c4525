import { describe, expect, it } from 'vitest';
import ref from '../../fixtures/scipy/regression.json';
import { PLANCK18 } from '../../../src/core/cosmology/index.js';
import { makeHaloModel } from '../../../src/core/halos/index.js';
import { auditCsv, auditMarkdown, runAudit, type AuditChoices } from '../../../src/core/audit/index.js';
import { DEFAULT_CHOICES } from '../../../src/ui/default-choices.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);

// The page's defaults (Planck 2018, Sheth–Tormen, EH98, the five IMF presets), on a test field.
const choices = (over: Partial<AuditChoices> = {}): AuditChoices => ({
  ...DEFAULT_CHOICES,
  draws: 2000,
  seed: 7,
  survey: { name: 'test-field', areaArcmin2: 40, zMin: 7, zMax: 11 },
  ...over,
});

describe('baryon budget in haloes (the method of Boylan-Kolchin 2023, Nat. Astron. 7, 731; Planck 2018, Sheth–Tormen, ε = 1)', () => {
  // ρ*_max(>M*) = f_b ρ_m(>M*/f_b) at z = 7–12 for M* = 1.574e10 Msun (halo 1e11): regression values from
  // test/fixtures/scipy, an independent scipy implementation of the same formulas (not numbers printed in the
  // paper; its exact figures are quoted here from memory only as a shape: a steep fall with z, ~0.6–0.7 dex per unit z at z ≈ 10).
  const hm = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen', deltaC: { kind: 'constant', value: 1.68647 } });
  const fb = hm.baryonFraction;
  it('ε f_b ρ_m(>1e11 Msun) at z = 7, 8, 9, 10, 11, 12 within 1%', () => {
    const want = ref.baryon_budget;
    want.z.forEach((z, i) => expect(rel(fb * hm.rhoAbove(want.mass_msun, z), want.fb_rho_above_msun_mpc3[i])).toBeLessThan(0.01));
  });
  it('n_h(>1e11 Msun) falls by 0.6–0.8 dex per unit z near z = 10 (shape), as in test/fixtures/scipy to 0.013 dex', () => {
    const slope = Math.log10(hm.nAbove(1e11, 9.5) / hm.nAbove(1e11, 10.5));
    expect(slope).toBeGreaterThan(0.6);
    expect(slope).toBeLessThan(0.8);
    // 0.013 dex = log10(1.03): the 3% allowed for n(>M) at ν > 4 (mass-function tests), at one end.
    expect(Math.abs(slope - ref.baryon_budget.dex_per_unit_z_9p5_to_10p5)).toBeLessThan(0.013);
  });
});

describe('constructed cases whose verdict follows from the physics (invented galaxies)', () => {
  const csv = `id,z,z_lo,z_hi,z_alt,p_alt,muv,log_mstar,imf_ref,log_mstar_err,log_mstar_alt
T-HUGE,10.0,9.9,10.1,,,,12.3,salpeter,0.05,
T-IMF,9.0,8.95,9.05,,,,11.1,salpeter,0.05,
T-ZALT,9.0,8.95,9.05,2.0,0.3,,11.1,salpeter,0.05,9.8
T-MODEST,8.0,7.9,8.1,,,-19.5,,,,
`;
  const r = runAudit(csv, choices());
  const byId = Object.fromEntries(r.galaxies.map((g) => [g.id, g]));
  it('far above the rarest halo under every IMF → over budget, holds under every IMF', () => {
    expect(byId['T-HUGE'].verdict).toBe('over budget');
    expect(byId['T-HUGE'].attribution).toContain('holds under every IMF');
    for (const v of Object.values(byId['T-HUGE'].imf!)) expect(v.verdict).not.toBe('within budget');
  });
  it('clears only with a top-heavy IMF → IMF-driven', () => {
    const g = byId['T-IMF'];
    expect(g.verdict).not.toBe('within budget');
    expect(g.attribution).toContain('IMF-driven');
    expect(g.imf!['top-heavy-flat'].verdict).toBe('within budget');
  });
  it('a likely low-redshift alternative → redshift-driven', () => {
    const g = byId["T-ZALT"];
    expect(g.verdict).not.toBe("within budget");
    expect(g.redshift_checks!.find((c) => c.kind === 'z_alt')!.verdict).toBe('within budget');
    expect(g.attribution).toContain('redshift-driven');
  });
  it('a modest galaxy → within budget, no attribution', () => {
    expect(byId['T-MODEST'].verdict).toBe('within budget');
    expect(byId['T-MODEST'].attribution).toEqual([]);
  });
  it('a top-heavy IMF never raises the mass for the same light', () => {
    for (const g of r.galaxies) {
      if (g.input.muv === '') continue;
      expect(g.imf!['top-heavy-flat'].log_mstar_median).toBeLessThan(g.imf!.salpeter.log_mstar_median);
    }
  });
  it('with cosmic variance the ceiling only rises (ε_req with variance ≤ without)', () => {
    for (const g of r.galaxies) {
      expect(g.ceiling!.halo_mass_at_quantile_cv_msun).toBeGreaterThanOrEqual(g.ceiling!.halo_mass_at_quantile_msun * (1 - 1e-9));
    }
  });
  it('every output number is finite (no NaN reaches a report) and the reports name the caution', () => {
    const walk = (x: unknown): void => {
      if (typeof x === 'number') expect(Number.isFinite(x)).toBe(true);
      else if (Array.isArray(x)) x.forEach(walk);
      else if (x && typeof x === 'object') Object.values(x).forEach(walk);
    };
    walk(r.galaxies);
    walk(r.sample);
    expect(auditMarkdown(r)).toMatch(/complements, not replaces/);
    expect(auditCsv(r).split('\n')).toHaveLength(5);
  });
});

describe('reproducibility', () => {
  const csv = `id,z,z_lo,z_hi,muv,mag_err\nR-1,9.5,9.2,9.8,-21,0.1\nR-2,8.1,7.9,8.4,-20,0.2\n`;
  it('same seed → identical JSON; another seed → different draws', () => {
    const a = JSON.stringify(runAudit(csv, choices()));
    const b = JSON.stringify(runAudit(csv, choices()));
    expect(a).toBe(b);
    expect(JSON.stringify(runAudit(csv, choices({ seed: 8 })).galaxies)).not.toBe(JSON.stringify(JSON.parse(a).galaxies));
  });
  it('re-running from the record (through JSON) reproduces the numbers exactly', () => {
    const first = runAudit(csv, choices());
    const rec = JSON.parse(JSON.stringify(first.record));
    const again = runAudit(rec.sample_csv, rec.choices);
    expect(JSON.stringify(again.galaxies)).toBe(JSON.stringify(first.galaxies));
    expect(JSON.stringify(again.sample)).toBe(JSON.stringify(first.sample));
  });
  it('more draws move a median by no more than its Monte Carlo error (4σ of the median)', () => {
    const small = runAudit(csv, choices({ draws: 1000 })).galaxies[0].imf!.salpeter;
    const big = runAudit(csv, choices({ draws: 8000 })).galaxies[0].imf!.salpeter;
    // σ(median) ≈ 1.2533 σ/√N with σ ≈ (p84 − p16)/2 in log M*.
    const s = (big.log_mstar_p84 - big.log_mstar_p16) / 2;
    expect(Math.abs(small.log_mstar_median - big.log_mstar_median)).toBeLessThan(4 * 1.2533 * s / Math.sqrt(1000));
  });
});

describe('bad input: every defect reported with row and column, good rows unaffected', () => {
  const good = 'G-1,9.0,8.8,9.2,,,-20.5,,,,,';
  const csv = [
    'id,z,z_lo,z_hi,z_alt,p_alt,muv,m_ab,lambda_obs_um,log_mstar,imf_ref,extra_col',
    good,
    'B-1,abc,,,,,-20,,,,,',
    'B-2,-1,,,,,-20,,,,,',
    'B-3,9.0,,,2,1.5,-20,,,,,',
    'B-4,9.0,,,,,,,,,,',
    'B-5,9.0,,,,,,27,,,,',
    'B-6,9.0,,,,,,,,10.5,,',
    'B-7,"9,1",,,,,-20,,,,,',
    'B-8,9.0,,,,,-20,,,,,',
    ',9.0,,,,,-20,,,,,',
    'G-1,9.0,,,,,-20,,,,,',
    'B-9,9.0,,,,,-20,,,10.5,salpeter,',
    'B-10,9.0,,,,,,26,0.9,,,',
    'B-11,1e400,,,,,-20,,,,,',
  ].join('\n');
  const r = runAudit(csv, choices());
  const rows = r.galaxies;
  const errs = (id: string) => rows.filter((g) => g.id === id).flatMap((g) => g.errors);
  it('reports each defect with its row, column and reason', () => {
    expect(errs('B-1')[0]).toMatchObject({ row: 2, column: 'z' });
    expect(errs('B-1')[0].reason).toMatch(/not a number/);
    expect(errs('B-2')[0]).toMatchObject({ column: 'z' });
    expect(errs('B-3').map((e) => e.column)).toContain('p_alt');
    expect(errs('B-4')[0].reason).toMatch(/no brightness/);
    expect(errs('B-5').map((e) => e.column)).toContain('lambda_obs_um');
    expect(errs('B-6').map((e) => e.column)).toContain('imf_ref');
    expect(errs('B-7')[0].reason).toMatch(/comma as decimal/);
    expect(rows.find((g) => g.row === 10)!.errors[0]).toMatchObject({ column: 'id' });
    expect(rows.find((g) => g.row === 11)!.errors[0].reason).toMatch(/repeats row 1/);
    expect(errs('B-9').map((e) => e.column)).toContain('muv/m_ab/log_mstar');
    expect(errs('B-10')[0]).toMatchObject({ column: '(model)' });
    expect(errs('B-10')[0].reason).toMatch(/Lyman-α/);
    expect(errs('B-11')[0].reason).toMatch(/floating-point range/);
  });
  it('keeps rejected rows in the output, audits the good ones, and echoes unknown columns', () => {
    expect(rows).toHaveLength(14);
    expect(rows.filter((g) => g.status === 'ok').map((g) => g.id)).toEqual(['G-1', 'B-8']);
    expect(r.sample.extra_columns).toEqual(['extra_col']);
    expect(rows[0].input.extra_col).toBe('');
  });
  it('good rows give the same numbers with or without the bad rows beside them', () => {
    const alone = runAudit(['id,z,z_lo,z_hi,z_alt,p_alt,muv,m_ab,lambda_obs_um,log_mstar,imf_ref,extra_col', good].join('\n'), choices());
    expect(JSON.stringify(alone.galaxies[0].imf)).toBe(JSON.stringify(rows[0].imf));
  });
});
