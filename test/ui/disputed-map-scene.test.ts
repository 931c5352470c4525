import { describe, expect, it } from 'vitest';
import { contourSegments, type DisputedMap } from '../../src/core/audit/index.js';
import { chainSegments } from '../../src/ui/chart/contour-lines.js';
import { colourRange, mapScene, mapSvg, SCREEN_FONTS } from '../../src/ui/chart/disputed-map-scene.js';
import { lightness, viridis, VIRIDIS_STOPS } from '../../src/ui/chart/viridis.js';

describe('viridis ramp', () => {
  it('L* of reference colours: black 0, white 100, sRGB grey 119 about 50 (CIE 1976 L*, IEC 61966-2-1; values from memory)', () => {
    expect(lightness('#000000')).toBeCloseTo(0, 6);
    expect(lightness('#ffffff')).toBeCloseTo(100, 6);
    expect(lightness('#777777')).toBeCloseTo(50.0, 0);
  });
  it('runs from the first to the last stop, and its lightness rises monotonically and nearly evenly (perceptually uniform, reads in greyscale)', () => {
    expect(viridis(0)).toBe(VIRIDIS_STOPS[0].toLowerCase());
    expect(viridis(1)).toBe(VIRIDIS_STOPS[VIRIDIS_STOPS.length - 1].toLowerCase());
    expect(viridis(Number.NaN)).toBe(viridis(0));
    const L = Array.from({ length: 101 }, (_, i) => lightness(viridis(i / 100)));
    for (let i = 1; i < L.length; i++) expect(L[i]).toBeGreaterThan(L[i - 1]);
    const steps = VIRIDIS_STOPS.slice(1).map((s, i) => lightness(s) - lightness(VIRIDIS_STOPS[i]));
    const mean = steps.reduce((a, b) => a + b) / steps.length;
    for (const s of steps) expect(s / mean).toBeGreaterThan(0.5), expect(s / mean).toBeLessThan(1.6);
    expect(L[100] - L[0]).toBeGreaterThan(60); // a wide range from dark to light
  });
});

describe('contour polylines', () => {
  it('joins the marching-squares segments of a circle (f = x² + y², level 1.05: no grid node on it) into one closed line on the circle', () => {
    const xs = Array.from({ length: 41 }, (_, i) => -2 + i * 0.1);
    const f = xs.map((y) => xs.map((x) => x * x + y * y));
    const segs = contourSegments(xs, xs, f, 1.05);
    const lines = chainSegments(segs);
    expect(lines).toHaveLength(1);
    const l = lines[0];
    expect(l.length).toBe(segs.length + 1);
    expect(Math.hypot(l[0][0] - l[l.length - 1][0], l[0][1] - l[l.length - 1][1])).toBeLessThan(1e-9);
    for (const [x, y] of l) expect(Math.abs(Math.hypot(x, y) - Math.sqrt(1.05))).toBeLessThan(0.02);
  });
  it('keeps separate lines apart', () => {
    const lines = chainSegments([[[0, 0], [1, 0]], [[5, 5], [6, 5]], [[1, 0], [2, 0]]]);
    expect(lines.map((l) => l.length).sort()).toEqual([2, 3]);
  });
});

/** An invented map: log10 ε_req = (z − 10) + (α − 1.3725), so ε_req = 1 lies on z + α = 11.3725 (between grid nodes). */
function plane(): DisputedMap {
  const z = Array.from({ length: 21 }, (_, i) => 8 + 0.2 * i);
  const slope = Array.from({ length: 38 }, (_, j) => Number((0.5 + 0.05 * j).toFixed(2)));
  const grid = slope.map((a) => z.map((zi) => zi - 10 + a - 1.3725));
  return {
    id: 'INV-1',
    headline_imf: 'salpeter',
    z,
    slope,
    log10_eps_required: grid,
    eps_ref: 0.3,
    contours: [1, 0.3].map((eps) => ({ eps, segments: contourSegments(z, slope, grid, Math.log10(eps)) })),
    galaxy: { z: 10.5, z_lo: 10.2, z_hi: 10.9, slope: 2.35 },
  };
}

describe('map scene', () => {
  const m = plane();
  const sc = mapScene(m, 600, SCREEN_FONTS, 'title', 'caption words');
  const frame = sc.frames[0];
  // Cell edges: half a step beyond the end nodes.
  const px = (z: number) => frame.x + ((z - 7.9) / (12.1 - 7.9)) * frame.w;
  const py = (a: number) => frame.y + frame.h - ((a - 0.475) / (2.375 - 0.475)) * frame.h;
  it('draws the ε = 1 contour where z + α = 11.3725, solid, and the ε_ref contour dashed', () => {
    const c1 = sc.lines.filter((l) => l.cls === 'contour-eps1');
    expect(c1.length).toBe(1);
    expect(c1[0].dash).toEqual([]);
    for (const [x, y] of c1[0].pts) {
      const z = 7.9 + ((x - frame.x) / frame.w) * 4.2;
      const a = 0.475 + ((frame.y + frame.h - y) / frame.h) * 1.9;
      expect(z + a).toBeCloseTo(11.3725, 6);
    }
    const cr = sc.lines.filter((l) => l.cls === 'contour-ref');
    expect(cr.length).toBe(1);
    expect(cr[0].dash.length).toBeGreaterThan(0);
  });
  it('colours cells by log10 ε on the ramp (lowest dark, highest light), the galaxy at its z and slope with its interval', () => {
    const [lo, hi] = colourRange(m);
    expect(lo).toBeCloseTo(-2.8725, 9);
    expect(hi).toBeCloseTo(2.9775, 9);
    const plotCells = sc.cells.slice(0, 21 * 38);
    expect(plotCells[0].fill).toBe(viridis(0)); // z = 8, α = 0.5: the lowest value
    expect(plotCells[plotCells.length - 1].fill).toBe(viridis(1));
    expect(sc.marks[0].x).toBeCloseTo(px(10.5), 6);
    expect(sc.marks[0].y).toBeCloseTo(py(2.35), 6);
    const bar = sc.lines.find((l) => l.cls === 'z-interval')!;
    expect(bar.pts[0][0]).toBeCloseTo(px(10.2), 6);
    expect(bar.pts[1][0]).toBeCloseTo(px(10.9), 6);
  });
  it('exports an SVG at the print width with the caption, finite coordinates only', () => {
    const { svg, widthPt } = mapSvg(m, 88, 'INV-1 map', 'Colour: log10 ε_req.');
    expect(widthPt).toBeCloseTo((88 / 25.4) * 72, 9);
    expect(svg).toContain('width="88mm"');
    expect(svg).toContain('<desc>Colour: log10 ε_req.</desc>');
    expect(svg).not.toMatch(/NaN|Infinity/);
  });
});
