import { beforeAll, describe, expect, it } from 'vitest';
import { galaxyPoints, runAudit, type AuditResult, type CeilingCurves, type GalaxyPoints } from '../../src/core/audit/index.js';
import { DEMO_SAMPLE_CSV } from '../../src/demo/demo-sample.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';
import { imfStyle } from '../../src/ui/palette.js';
import { densityFigure, explorerFigure, galaxyImfFigure, massRedshiftFigure } from '../../src/ui/chart/figures.js';
import { DENSITY_ABOVE, labelPoints, MAX_LABELS, THIN_ABOVE } from '../../src/ui/chart/legibility.js';
import { chartToSvg } from '../../src/ui/chart/svg-export.js';

let r: AuditResult;
const imfs = ['salpeter', 'chabrier', 'kroupa', 'top-heavy-flat', 'top-heavy-cmb'];
/** Ceiling curves of a fixed shape: the figure builder only copies them. */
const curves = (): CeilingCurves => {
  const z = Float64Array.from({ length: 11 }, (_, i) => 7 + 0.4 * i);
  const f = (d: number) => Float64Array.from(z, (zz) => 11.5 - 0.2 * (zz - 7) + d);
  return { z, log10MstarEps1: f(0), log10MstarEpsRef: f(Math.log10(0.3)), log10MstarEps1Q16: f(-0.3), log10MstarEps1Q84: f(0.2) };
};
/** n invented galaxies per IMF, every tenth in tension via `verdicts`. */
function manyPoints(n: number, names: string[]): { points: GalaxyPoints[]; result: AuditResult } {
  const ids = Array.from({ length: n }, (_, i) => `M-${i}`);
  const z = Float64Array.from(ids, (_, i) => 7 + (4 * i) / n);
  const m = Float64Array.from(ids, (_, i) => 8 + 3 * ((i * 0.618) % 1));
  const points = names.map((imf) => ({ imf, ids, z, log10M: m, log10MLo: m.map((v) => v - 0.3), log10MHi: m.map((v) => v + 0.3) }));
  const galaxies = ids.map((id, i) => ({ id, row: i + 1, status: 'ok', verdict: i % 10 === 0 ? 'over budget' : 'within budget' }));
  return { points, result: { ...r, galaxies } as unknown as AuditResult };
}

beforeAll(() => {
  r = runAudit(DEMO_SAMPLE_CSV, { ...DEFAULT_CHOICES, draws: 200 });
});

describe('figure models', () => {
  it('give every IMF its palette style whatever the order of the IMFs', () => {
    const a = massRedshiftFigure(r, curves(), galaxyPoints(r, imfs));
    const b = massRedshiftFigure(r, curves(), galaxyPoints(r, [...imfs].reverse()));
    for (const m of [a, b]) for (const s of m.markers) expect({ color: s.color, shape: s.shape }).toEqual(imfStyle(s.label));
    const g = galaxyImfFigure(r, 'QF-322');
    for (const s of g.markers) expect({ color: s.color, shape: s.shape }).toEqual(imfStyle(s.label));
  });

  it('cite the methods in the captions as a paper would, never by their internal names', () => {
    const caps = [massRedshiftFigure(r, curves(), galaxyPoints(r, imfs)), densityFigure(r), galaxyImfFigure(r, 'QF-322')].map((m) => m.caption);
    for (const c of caps) {
      expect(c).toContain('Sheth & Tormen (1999)');
      expect(c).toContain('Eisenstein & Hu (1998)');
      expect(c).toContain('Planck Collaboration (2020)');
      expect(c).not.toMatch(/sheth-tormen|eh98/);
    }
    expect(caps[0]).toContain('Salpeter (1955); Chabrier (2003); Kroupa (2001)');
    const ex = explorerFigure(new Float64Array([10, 11]), [{ name: 'press-schechter', label: 'x', log10N: new Float64Array([-3, -5]) }], 10, 'H0 = 67.66', 'bbks');
    expect(ex.caption).toContain('Press & Schechter (1974)');
    expect(ex.caption).toContain('Bardeen et al. (1986)');
    expect(ex.lines[0].label).toBe('Press & Schechter (1974)');
  });

  it('flag the galaxies in tension (headline verdict strained or over budget) for drawing on top', () => {
    const m = massRedshiftFigure(r, curves(), galaxyPoints(r, imfs));
    const s = m.markers[0];
    const flagged = s.ids!.filter((_, i) => s.tension![i] === 1).sort();
    const expected = r.galaxies.filter((g) => g.verdict === 'strained' || g.verdict === 'over budget').map((g) => g.id).sort();
    expect(expected.length).toBeGreaterThan(0);
    expect(flagged).toEqual(expected);
    expect(m.caption).toContain('drawn on top');
  });

  it('keep thousands of points legible: full size up to 1500, thinner beyond, a density layer beyond 6000, and say so', () => {
    const few = massRedshiftFigure(r, curves(), galaxyPoints(r, imfs));
    expect(few.points!.radius).toBe(5);
    const mid = manyPoints(1500, ['salpeter', 'kroupa']);
    const m2 = massRedshiftFigure(mid.result, curves(), mid.points);
    expect(m2.points!.radius).toBeLessThan(5);
    expect(m2.points!.errorWidth).toBeLessThan(1.5);
    expect(m2.density).toBeUndefined();
    expect(m2.caption).toContain(`All 3000 points are drawn; with more than ${THIN_ABOVE}`);
    const big = manyPoints(4000, ['salpeter', 'kroupa']);
    const m3 = massRedshiftFigure(big.result, curves(), big.points);
    expect(m3.density).toBeDefined();
    expect(m3.points!.errorWidth).toBe(0);
    expect(m3.density!.counts.reduce((a, b) => a + b, 0)).toBe(8000);
    expect(m3.caption).toContain(`with more than ${DENSITY_ABOVE}, error bars are shown only for galaxies in tension`);
  });

  it('label the highlighted galaxy always and galaxies in tension on request, most massive first, at most MAX_LABELS', () => {
    const big = manyPoints(4000, ['salpeter']);
    const m = massRedshiftFigure(big.result, curves(), big.points);
    expect(labelPoints(m, 'M-7', false).labels.map((l) => l.id)).toEqual(['M-7']);
    const { labels, omitted } = labelPoints(m, 'M-7', true);
    expect(labels.length).toBe(MAX_LABELS + 1);
    expect(omitted).toBe(400 - MAX_LABELS);
    const ys = labels.filter((l) => !l.highlight).map((l) => l.y);
    expect([...ys].sort((a, b) => b - a)).toEqual(ys);
  });
});

describe('SVG at print size', () => {
  it('is 88 mm wide with fonts between 6.5 and 8.5 pt, keeps the 16–84% band as a filled region, and draws each legend line in its own dash', () => {
    const m = massRedshiftFigure(r, curves(), galaxyPoints(r, imfs));
    const svg = chartToSvg(m, { widthMm: 88, highlight: 'QF-322' });
    expect(svg).toMatch(/^<svg [^>]*width="88mm"/);
    const sizes = [...svg.matchAll(/font-size="([\d.]+)"/g)].map((x) => Number(x[1]));
    expect(Math.min(...sizes)).toBeGreaterThanOrEqual(6.5);
    expect(Math.max(...sizes)).toBeLessThanOrEqual(8.5);
    expect(svg).toMatch(/<polygon class="band" points="[^"]+" fill="#787878"/);
    const legend = [...svg.matchAll(/<line class="legend-line"[^>]*\/>/g)].map((x) => /stroke-dasharray="([^"]+)"/.exec(x[0])?.[1] ?? 'solid');
    expect(legend).toEqual(['solid', '4.8 3', '0.9 1.8']);
    expect(svg).toContain('<circle class="highlight"');
    expect(svg).toMatch(/<text class="label"[^>]*>QF-322<\/text>/);
    expect(svg).toContain('Ringed and labelled: QF-322.');
  });

  it('leaves title and caption out on request (for a paper that typesets its own caption)', () => {
    const svg = chartToSvg(densityFigure(r), { widthMm: 180, caption: false });
    expect(svg).toMatch(/width="180mm"/);
    expect(svg).not.toContain('font-weight="bold">Cumulative');
    expect(svg).toContain('<desc>');
  });
});
