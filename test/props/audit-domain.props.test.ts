import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { toJson } from '../../src/cli/output.js';
import { auditCsv, auditMarkdown, CHOICE_SPECS, firstNonFinite, runAudit, SURVEY_SPECS, type AuditChoices } from '../../src/core/audit/index.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

// No parameter uncertainty here (its spread has its own tests): every run would otherwise build 11 cosmologies.
const NO_SPREAD = { matrix: [0, 1, 2, 3, 4].map(() => [0, 0, 0, 0, 0]), source: 'held fixed in this test' };
const BASE: AuditChoices = { ...DEFAULT_CHOICES, draws: 100, imfs: ['salpeter', 'top-heavy-flat'], cosmologyCovariance: NO_SPREAD };
const dbl = (min: number, max: number): fc.Arbitrary<number> => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const cell = (a: fc.Arbitrary<number>): fc.Arbitrary<string> => fc.option(a.map(String), { nil: '' });

/** Rows anywhere in the documented domain of the sample columns (many are rejected; none may sink the run). */
const rowArb = fc.record({
  z: dbl(0.25, 30),
  dzLo: dbl(0, 3),
  dzHi: dbl(0, 3),
  kind: fc.constantFrom('muv', 'm_ab', 'log_mstar'),
  muv: dbl(-29.9, -5.1),
  mab: dbl(10.1, 39.9),
  lam: dbl(0.1, 30),
  lm: dbl(3.1, 13.9),
  err: dbl(0, 5),
  beta: cell(dbl(-3.9, 3.9)),
  zAlt: fc.option(dbl(0.05, 30), { nil: undefined }),
  pAlt: dbl(0, 1),
});
const HEADER = 'id,z,z_lo,z_hi,z_alt,p_alt,muv,m_ab,lambda_obs_um,log_mstar,imf_ref,log_mstar_err,mag_err,beta';
type Row = typeof rowArb extends fc.Arbitrary<infer T> ? T : never;
const line = (r: Row, i: number): string =>
  [
    `R-${i}`, r.z, Math.max(0, r.z - r.dzLo), Math.min(30, r.z + r.dzHi), r.zAlt ?? '', r.zAlt !== undefined ? r.pAlt : '',
    r.kind === 'muv' ? r.muv : '', r.kind === 'm_ab' ? r.mab : '', r.kind === 'm_ab' ? r.lam : '', r.kind === 'log_mstar' ? r.lm : '',
    r.kind === 'log_mstar' ? 'salpeter' : '', r.err, r.err, r.beta,
  ].join(',');

function checkOutputs(csv: string, choices: AuditChoices): void {
  const res = runAudit(csv, choices);
  expect(firstNonFinite(res, '')).toBeUndefined();
  expect(() => toJson(res)).not.toThrow();
  for (const g of res.galaxies) if (g.status === 'rejected') for (const e of g.errors) expect(e.reason.length).toBeGreaterThan(5);
  expect(auditCsv(res)).not.toMatch(/\bNaN\b|Infinity|undefined/);
  expect(auditMarkdown(res)).not.toMatch(/\bNaN\b|Infinity|undefined/);
}

describe('no accepted row or choice can sink the run, property-based', () => {
  it('rows anywhere in the sample domain: each is audited or rejected with a reason; nothing non-finite in any format', () => {
    fc.assert(
      fc.property(fc.array(rowArb, { minLength: 1, maxLength: 4 }), (rows) => {
        checkOutputs([HEADER, ...rows.map(line)].join('\n'), BASE);
      }),
      { numRuns: 25 },
    );
  }, 60000);

  it('choices anywhere in the table ranges give finite numbers for a fixed sample', () => {
    const spec = (k: string) => [...CHOICE_SPECS, ...SURVEY_SPECS].find((s) => s.key === k)!;
    const inRange = (k: string): fc.Arbitrary<number> => {
      const s = spec(k);
      return s.integer ? fc.integer({ min: s.min, max: s.max }) : dbl(s.min, s.max);
    };
    const logArea = dbl(Math.log10(spec('areaArcmin2').min), Math.log10(spec('areaArcmin2').max)).map((x) => Math.min(Math.max(10 ** x, spec('areaArcmin2').min), spec('areaArcmin2').max)); // 10 ** log10(min) can round below min
    fc.assert(
      fc.property(inRange('epsRef'), inRange('quantile'), inRange('sliceDz'), inRange('formationZ'), logArea, dbl(0, 29), dbl(0.5, 12), (epsRef, quantile, sliceDz, formationZ, area, z0, width) => {
        const zMax = Math.min(30, z0 + width);
        const choices = { ...BASE, epsRef, quantile, sliceDz, formationZ, survey: { name: 'field', areaArcmin2: area, zMin: z0, zMax } };
        checkOutputs('id,z,z_lo,z_hi,muv,mag_err\nA,9.2,9.0,9.5,-21,0.2\nB,16,14,17,-22.5,0.3\nC,0.3,0.25,0.4,-18,0.1\n', choices);
      }),
      { numRuns: 8 },
    );
  }, 60000);

  it('the reproduced cases: low redshift, a very dusty bright row, a huge reported mass at z 25', () => {
    const r = runAudit(
      'id,z,muv,beta,mag_err,log_mstar,log_mstar_err,imf_ref\nLOW1,0.05,-20,,,,,\nLOW2,0.01,-20,,,,,\nDUSTY,9,-25,3.9,0.3,,,\nHEAVY,25,,,,13.9,0.5,salpeter\nOK,9,-20,,,,,\n',
      { ...BASE, draws: 200, imfs: [...DEFAULT_CHOICES.imfs] },
    );
    const by = Object.fromEntries(r.galaxies.map((g) => [g.id, g]));
    expect(by.LOW1.errors[0]).toMatchObject({ column: 'z', reason: expect.stringMatching(/\[0\.25, 30\]/) });
    expect(by.LOW2.errors[0]).toMatchObject({ column: 'z' });
    // Their host halo lies beyond the mass function's reach: rejected with the field named, or finite.
    for (const id of ['DUSTY', 'HEAVY']) if (by[id].status === 'rejected') expect(by[id].errors[0].reason).toMatch(/non-finite [a-z_.]+|failed/);
    expect(['DUSTY', 'HEAVY'].some((id) => by[id].status === 'rejected')).toBe(true);
    expect(by.OK.status).toBe('ok');
    expect(firstNonFinite(r, '')).toBeUndefined();
  });
});
