import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { IMF_PRESETS } from '../../src/core/stars/index.js';
import { MASS_FUNCTION_NAMES } from '../../src/core/halos/index.js';
import { CUSTOM_COLORS, CUSTOM_SHAPES, IMF_STYLES, MASS_FUNCTION_STYLES, OKABE_ITO, canonicalImfName, fnv1a, imfStyle, massFunctionStyle } from '../../src/ui/palette.js';

const hex = (r: number, g: number, b: number): string => '#' + [r, g, b].map((v) => v.toString(16).padStart(2, '0')).join('').toUpperCase();

describe('palette', () => {
  it('OKABE_ITO holds the eight colours of Okabe & Ito (2008) as published in RGB 0–255 (from memory)', () => {
    expect(Object.values(OKABE_ITO).sort()).toEqual(
      [hex(0, 0, 0), hex(230, 159, 0), hex(86, 180, 233), hex(0, 158, 115), hex(240, 228, 66), hex(0, 114, 178), hex(213, 94, 0), hex(204, 121, 167)].sort(),
    );
  });

  it('every IMF preset of the core has a fixed style, with distinct colours and distinct shapes from that set', () => {
    const names = IMF_PRESETS.map((p) => p.name);
    expect(Object.keys(IMF_STYLES).sort()).toEqual([...names].sort());
    const styles = names.map(imfStyle);
    expect(new Set(styles.map((s) => s.color)).size).toBe(names.length);
    expect(new Set(styles.map((s) => s.shape)).size).toBe(names.length);
    for (const s of styles) expect(Object.values(OKABE_ITO)).toContain(s.color);
  });

  it('an IMF style depends on the name alone, not on which IMFs are compared or in what order', () => {
    const a = ['salpeter', 'kroupa', 'custom:0.1:1.3:0.5:2.3:100'];
    const one = a.map(imfStyle);
    const two = [...a].reverse().map(imfStyle).reverse();
    expect(two).toEqual(one);
    expect(imfStyle('kroupa')).toEqual({ color: OKABE_ITO.bluishGreen, shape: 'triangle' });
  });

  it('a custom IMF never takes a preset colour or a preset shape, and equal specs written differently share a style', () => {
    const presetColors = new Set(Object.values(IMF_STYLES).map((s) => s.color));
    const presetShapes = new Set(Object.values(IMF_STYLES).map((s) => s.shape));
    const num = fc.double({ min: 0.01, max: 300, noNaN: true }).map((x) => Number(x.toPrecision(3)));
    fc.assert(
      fc.property(fc.array(num, { minLength: 3, maxLength: 9 }), (xs) => {
        const s = imfStyle('custom:' + xs.join(':'));
        return !presetColors.has(s.color) && !presetShapes.has(s.shape) && CUSTOM_COLORS.includes(s.color) && CUSTOM_SHAPES.includes(s.shape);
      }),
    );
    expect(canonicalImfName('custom:0.10:1.30:100.0')).toBe('custom:0.1:1.3:100');
    expect(imfStyle('custom:0.10:1.30:100.0')).toEqual(imfStyle('custom:0.1:1.3:100'));
  });

  it('custom IMFs spread over every colour and shape left for them', () => {
    const seen = new Set<string>();
    for (let i = 0; i < 200; i++) {
      const s = imfStyle(`custom:0.1:${(1 + i / 100).toFixed(2)}:100`);
      seen.add(`${s.color}|${s.shape}`);
    }
    expect(seen.size).toBe(CUSTOM_COLORS.length * CUSTOM_SHAPES.length);
  });

  it('fnv1a matches the published FNV-1a 32-bit test vectors (Fowler/Noll/Vo test suite, from memory)', () => {
    expect(fnv1a('')).toBe(0x811c9dc5);
    expect(fnv1a('a')).toBe(0xe40c292c);
    expect(fnv1a('foobar')).toBe(0xbf9cf968);
  });

  it('every mass function has its own line: distinct colours and distinct dash patterns', () => {
    expect(Object.keys(MASS_FUNCTION_STYLES).sort()).toEqual([...MASS_FUNCTION_NAMES].sort());
    const st = MASS_FUNCTION_NAMES.map(massFunctionStyle);
    expect(new Set(st.map((s) => s.color)).size).toBe(st.length);
    expect(new Set(st.map((s) => s.dash.join(','))).size).toBe(st.length);
  });
});
