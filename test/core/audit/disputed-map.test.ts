import { describe, expect, it } from 'vitest';
import { auditRow, prepareAudit, type AuditChoices } from '../../../src/core/audit/index.js';
import { contourSegments, disputedMap, highMassSlope } from '../../../src/core/audit/disputed-map.js';
import { DEFAULT_CHOICES } from '../../../src/ui/default-choices.js';

describe('contour segments (marching squares)', () => {
  it('for a linear field f = x + 2y every segment end lies exactly on x + 2y = level (linear interpolation is exact)', () => {
    const xs = [0, 1, 2, 3, 4];
    const ys = [0, 0.5, 1, 1.5];
    const f = ys.map((y) => xs.map((x) => x + 2 * y));
    const segs = contourSegments(xs, ys, f, 2.3);
    expect(segs.length).toBeGreaterThan(2);
    for (const s of segs) for (const [x, y] of s) expect(Math.abs(x + 2 * y - 2.3)).toBeLessThan(1e-12);
  });
  it('no crossing, no segment', () => {
    expect(contourSegments([0, 1], [0, 1], [[0, 0], [0, 0]], 1)).toEqual([]);
  });
});

describe('the map of a disputed galaxy (invented)', () => {
  // Kroupa is exactly the map's family at α = 2.3 (custom:0.1:1.3:0.5:2.3:100)
  const choices: AuditChoices = { ...DEFAULT_CHOICES, imfs: ['kroupa'], draws: 2000, seed: 4, survey: { name: 'test-field', areaArcmin2: 40, zMin: 9.5, zMax: 10.5 } };
  const csv = 'id,z,z_lo,z_hi,m_ab,lambda_obs_um,mag_err\nD-1,10.0,9.9,10.1,19.6,1.5,0.1\n';
  const prep = prepareAudit(csv, choices);
  const g = auditRow(prep, 0);
  const map = disputedMap(prep, 0);
  it('knows the headline IMF’s high-mass slope (Kroupa 2.3, Salpeter 2.35, flat top-heavy 1)', () => {
    expect(map.galaxy.slope).toBe(2.3);
    expect(highMassSlope('salpeter', 10)).toBe(2.35);
    expect(highMassSlope('top-heavy-flat', 10)).toBe(1);
  });
  it('ε_req rises with redshift and with α (fewer massive stars per unit mass)', () => {
    const j = map.slope.indexOf(2.3);
    const row = map.log10_eps_required[j];
    for (let i = 1; i < row.length; i++) expect(row[i]).toBeGreaterThan(row[i - 1] - 0.02); // MC noise of 1000 draws
    expect(map.log10_eps_required[map.slope.length - 1][10]).toBeGreaterThan(map.log10_eps_required[0][10]);
  });
  it('along α = 2.3 the ε = 1 contour sits at the reconciliation’s z_max (grid step and Monte Carlo, 0.15 in z)', () => {
    expect(g.verdict).toBe('over budget');
    const zMax = g.reconcile![0].z_max!;
    const j = map.slope.indexOf(2.3);
    const row = map.log10_eps_required[j];
    const i = row.findIndex((v, k) => k > 0 && row[k - 1] < 0 && v >= 0);
    const zCross = map.z[i - 1] + ((0 - row[i - 1]) / (row[i] - row[i - 1])) * (map.z[i] - map.z[i - 1]);
    expect(Math.abs(zCross - zMax)).toBeLessThan(0.15);
    expect(map.contours.map((c) => c.eps)).toEqual([1, 0.3]);
    expect(map.contours[0].segments.length).toBeGreaterThan(0);
  });
});
