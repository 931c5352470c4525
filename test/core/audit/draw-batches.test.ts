import { describe, expect, it } from 'vitest';
import { makeBackground, PLANCK18 } from '../../../src/core/cosmology/index.js';
import { makeHaloModel } from '../../../src/core/halos/index.js';
import { makeAccretionHistory } from '../../../src/core/audit/accretion.js';
import { makeCeilingTable } from '../../../src/core/audit/ceiling.js';
import { drawGalaxy, fastBackground, galaxyDeviates, tabulatedBackground } from '../../../src/core/audit/galaxy-draws.js';
import { idSeed, makeRandom } from '../../../src/core/audit/random.js';
import { fixedRedshiftCells } from '../../../src/core/audit/galaxy-audit.js';
import { rescaleBase, rescalePosition } from '../../../src/core/audit/imf-rescale.js';
import { prepareAudit, type AuditChoices } from '../../../src/core/audit/index.js';
import { logAccretedBaryons, logAccretedBaryonsOfDraws } from '../../../src/core/audit/time-budget.js';

// The Monte Carlo's batch forms against the per-point functions they replace (the per-point ones are
// checked against the papers in time-budget.test.ts and the ceiling tests).
const bg = makeBackground(PLANCK18);
const FB = 0.157424;

/** Choices for the draw tests: only the IMFs, the draws, the seed and the field's redshifts differ. */
function drawChoices(imfs: string[], draws: number, seed: number, zMin = 7, zMax = 11): AuditChoices {
  return {
    cosmology: PLANCK18, massFunction: 'sheth-tormen', transfer: { kind: 'eh98' }, deltaC: { kind: 'constant', value: 1.686 },
    imfs, sfh: 'constant', metallicity: 0.02, epsRef: 0.3, quantile: 0.997,
    draws, seed, sliceDz: 1, formationZ: 30, survey: { name: 'draws', areaArcmin2: 40, zMin, zMax }, surveys: [], zBins: [],
  };
}

/** The first row of csv prepared with choices, its cells at the fixed redshift zf and its draws there. */
function placedAt(csv: string, choices: AuditChoices, zf: number) {
  const prep = prepareAudit(csv, choices);
  const g = prep.parsed.rowAt(0).galaxy!;
  const cells = fixedRedshiftCells(prep.ctx, g, zf, choices.draws)!;
  const d = drawGalaxy(g, choices.draws, idSeed(choices.seed, g.id), prep.ctx.halo.background, { z: zf, alt: false });
  return { prep, g, cells, d };
}

describe('time budget per draw: logAccretedBaryonsOfDraws equals logAccretedBaryons on the same tables', () => {
  const tab = tabulatedBackground(bg);
  const history = makeAccretionHistory(tab);
  const lnAgeAt = fastBackground(bg).lnAgeAt;
  for (const formationZ of [30, 12, 9]) {
    it(`formation z = ${formationZ}: 5000 draws (z 4–16, ages 1 Myr to t(z), haloes 1e9–1e13 Msun) agree to 1e-12 in ΔM_h, and empty intervals are −∞ in both`, () => {
      const rnd = makeRandom(formationZ);
      const n = 5000;
      const z = new Float64Array(n);
      const x = new Float64Array(n);
      const lnT = new Float64Array(n);
      const age = new Float64Array(n);
      const halo = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        z[i] = 4 + 12 * rnd.uniform();
        x[i] = Math.log1p(z[i]);
        lnT[i] = lnAgeAt(x[i]);
        // log-uniform from 1 Myr to the age of the universe at z (as galaxy-draws.ts draws it)
        age[i] = rnd.uniform() * (Math.log10(tab.ageGyr(z[i])) + 3);
        halo[i] = 9 + 4 * rnd.uniform();
      }
      const idx = Int32Array.from({ length: n }, (_, i) => i);
      const got = logAccretedBaryonsOfDraws(tab, history, FB, formationZ, n, idx, x, lnT, age, halo, new Float64Array(n));
      const want = logAccretedBaryons(tab, history, FB, formationZ, z, age, halo);
      let empty = 0;
      for (let i = 0; i < n; i++) {
        if (want[i] === Number.NEGATIVE_INFINITY) {
          empty++;
          expect(got[i]).toBe(Number.NEGATIVE_INFINITY);
          continue;
        }
        // rounding only: the same tables and formula, the log1p/expm1 round trips left out; 1e-12
        // relative in ΔM_h is 4.3e-13 in log10 (the tables themselves are good to ~1e-6). Where the
        // interval is short, f = ΔM_h/M_h ≪ 1, the per-point form loses ~2.2e-16 × 10/f relative in
        // ln(y/y0) (y/y0 = 1 + f/10 rounded), which the batch form avoids (1 − q¹⁰ as a product of
        // positive terms): up to 4e-15/f more.
        const f = 10 ** (want[i] - Math.log10(FB) - halo[i]);
        expect(Math.abs(got[i] - want[i])).toBeLessThan(4.4e-13 + 4e-15 / f);
      }
      if (formationZ === 9) expect(empty).toBeGreaterThan(0);
    });
  }
});

describe('ceiling lookups per batch: log10HaloMassesAt equals the per-point lookups bit for bit', () => {
  const halo = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen' });
  const ceil = makeCeilingTable(halo, 40, 0.997, 0.05, 16, 1);
  const rnd = makeRandom(5);
  const n = 3000;
  const z = Float64Array.from({ length: n }, () => 5 + 9 * rnd.uniform());
  const idx = Int32Array.from({ length: 1000 }, () => Math.floor(n * rnd.uniform()));
  it('without cosmic variance, every draw and through an index', () => {
    const out = ceil.log10HaloMassesAt(z, undefined, n, undefined, -0.8, new Float64Array(n));
    for (let i = 0; i < n; i++) expect(out[i]).toBe(-0.8 + ceil.log10HaloMassAtQuantile(z[i]));
    const sub = ceil.log10HaloMassesAt(z, idx, idx.length, undefined, 0, new Float64Array(idx.length));
    for (let i = 0; i < idx.length; i++) expect(sub[i]).toBe(0 + ceil.log10HaloMassAtQuantile(z[idx[i]]));
  });
  it('with cosmic variance (σ_dm = 0.12)', () => {
    const out = ceil.log10HaloMassesAt(z, idx, idx.length, 0.12, -0.8, new Float64Array(idx.length));
    for (let i = 0; i < idx.length; i++) expect(out[i]).toBe(-0.8 + ceil.log10HaloMassAtQuantileCv(z[idx[i]], 0.12));
  });
  it('a redshift outside the table is refused with the per-point message', () => {
    expect(() => ceil.log10HaloMassesAt([3, 40], undefined, 2, undefined, 0, new Float64Array(2))).toThrow(/outside the ceiling table/);
  });
});

describe("grid positions per batch: the draws' cells in the M/L tables equal the table's own gridPositionLog", () => {
  it('a brightness row at a fixed redshift: x and y of every valid draw, bit for bit', () => {
    const { prep, g, cells, d } = placedAt('id,z,z_lo,z_hi,muv,mag_err,beta\nG-1,8.4,8.1,8.8,-20.3,0.1,-2.0', drawChoices(['salpeter'], 3000, 4), 8.1);
    const tab = prep.ctx.cache.table('salpeter', g.z, prep.ctx.sfh);
    let m = 0;
    for (let k = 0; k < d.n; k++) {
      if (!Number.isFinite(d.log10Lnu[k])) continue;
      const [x, y] = tab.gridPositionLog(d.log10AgeMyr[k], d.log10LambdaRestUm[k]);
      expect(cells.gx[m]).toBe(x);
      expect(cells.gy[m]).toBe(y);
      m++;
    }
    expect(m).toBe(cells.gx.length);
    expect(m).toBeGreaterThan(2000);
  });
});

describe("draws at a fixed redshift from the galaxy's kept deviates: the same draws as from its stream", () => {
  const choices = drawChoices(['salpeter'], 3000, 9, 3, 12);
  const csv = [
    'id,z,z_lo,z_hi,z_alt,p_alt,muv,m_ab,lambda_obs_um,log_mstar,imf_ref,log_mstar_err,log_mstar_alt,mag_err,beta,beta_err',
    'K-light,8.4,8.1,8.8,3.2,0.2,-20.3,,,,,,,0.12,-2.1,0.3',
    'K-band,9.1,8.9,9.4,,,,27.4,1.5,,,,,0.08,,',
    'K-mass,7.6,7.3,7.9,2.9,0.3,,,,9.8,salpeter,0.2,9.1,,,',
  ].join('\n');
  const prep = prepareAudit(csv, choices);
  for (let row = 0; row < 3; row++) {
    const g = prep.parsed.rowAt(row).galaxy!;
    it(`${g.id}: every array of drawGalaxy at three redshifts, with and without the alternative, bit for bit`, () => {
      const seed = idSeed(choices.seed, g.id);
      const kept = galaxyDeviates(g, 3000, seed);
      for (const z of [g.z - 0.3, g.z + 0.7, 5.5]) {
        for (const alt of [false, true]) {
          const fresh = drawGalaxy(g, 3000, seed, prep.ctx.halo.background, { z, alt });
          // copied out: drawGalaxy without scratch gives fresh arrays, so the two sets do not share storage
          const fromKept = drawGalaxy(g, 3000, seed, prep.ctx.halo.background, { z, alt }, undefined, kept);
          expect(fromKept).toEqual(fresh);
        }
      }
      expect(fixedRedshiftCells(prep.ctx, g, 8, 2500, kept)).toEqual(fixedRedshiftCells(prep.ctx, g, 8, 2500));
      expect(() => drawGalaxy(g, 3001, seed, prep.ctx.halo.background, { z: 8, alt: false }, undefined, kept)).toThrow(/3001 asked for, 3000 deviates kept/);
    });
  }
});

describe('draws at a fixed redshift: the terms read once per redshift are those each draw reads on its own', () => {
  it('a row with no redshift error: its own draws (z read per draw) equal the draws placed at its z, bit for bit', () => {
    const g = { row: 1, id: 'P-1', z: 8.73, pAlt: 0, muv: -20.6, log10MstarErr: 0, magErr: 0.15, beta: -2.2, betaErr: 0.2 };
    const own = drawGalaxy(g, 2000, 77, bg);
    const placed = drawGalaxy(g, 2000, 77, bg, { z: g.z, alt: false });
    expect(own.z.every((z) => z === g.z)).toBe(true);
    expect(placed).toEqual(own);
  });
});

describe("grid positions per batch, reported masses: the draws' cells equal rescalePosition and the base rescaleBase", () => {
  it('a reported-mass row at a fixed redshift: x, y and base of every draw, bit for bit', () => {
    const { prep, g, cells, d } = placedAt('id,z,z_lo,z_hi,log_mstar,log_mstar_err,imf_ref\nM-1,8.2,7.9,8.6,9.9,0.2,salpeter', drawChoices(['chabrier'], 2000, 5), 7.7);
    const head = prep.ctx.cache.table('salpeter', g.z, prep.ctx.sfh);
    expect(cells.gx.length).toBe(d.n);
    for (let k = 0; k < d.n; k++) {
      const [x, y] = rescalePosition(head, d.log10AgeMyr[k]);
      expect(cells.gx[k]).toBe(x);
      expect(cells.gy[k]).toBe(y);
      expect(cells.base[k]).toBe(rescaleBase(d.log10MassRef[k], head, x, y));
    }
  });
});

describe('a reported mass placed at another redshift: scaled with the light it implies', () => {
  it('log10 M⋆ moves by log10[D_L(z′)² (1+z)/(D_L(z)² (1+z′))] per draw (L_ν = 4π D_L² f_ν/(1+z), Hogg 1999 §7, the section from memory), D_L from the direct integral', () => {
    // the same deviates at both redshifts, so the difference per draw is the scaling alone
    const g = { row: 1, id: 'RM-1', z: 8.3, zLo: 8.0, zHi: 8.7, pAlt: 0, log10Mstar: 9.7, log10MstarErr: 0.2, imfRef: 'salpeter', magErr: 0, betaErr: 0 };
    const atZ = drawGalaxy(g, 1000, 21, bg, { z: g.z, alt: false });
    for (const zf of [6.1, 9.6, 11.4]) {
      const moved = drawGalaxy(g, 1000, 21, bg, { z: zf, alt: false });
      const want = (2 * Math.log(bg.luminosityDistanceMpc(zf) / bg.luminosityDistanceMpc(g.z)) - Math.log((1 + zf) / (1 + g.z))) / Math.LN10;
      // the draws read D_L from ln(1+z) tables good to 1e-7 relative: 2e-7 / ln 10 in the log, and rounding
      for (let k = 0; k < moved.n; k++) expect(Math.abs(moved.log10MassRef[k] - atZ.log10MassRef[k] - want)).toBeLessThan(1e-6);
      expect(Math.abs(want)).toBeGreaterThan(0.05);
    }
  });
});
