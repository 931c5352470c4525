/**
 * The one place that styles IMFs, mass functions and verdicts, for the results table, every figure and every
 * export. Colours are the colour-blind-safe set of Okabe & Ito (2008, "Color Universal Design"); every IMF also
 * has its own marker shape, so the series stay apart in greyscale and for every kind of colour vision.
 *
 * A style depends only on the IMF's name, never on which IMFs are ticked or in what order. Presets have
 * fixed styles; a custom IMF gets one derived from its spec, drawn from colours and shapes no preset uses,
 * so it can never be mistaken for a preset.
 */

/** Okabe & Ito (2008) colours, by their names. */
export const OKABE_ITO = {
  black: '#000000',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
} as const;

export type Shape = 'circle' | 'square' | 'triangle' | 'diamond' | 'cross' | 'triangle-down' | 'star' | 'x';
export const SHAPE_GLYPH: Record<Shape, string> = { circle: '●', square: '■', triangle: '▲', diamond: '◆', cross: '✚', 'triangle-down': '▼', star: '★', x: '✖' };

export interface SeriesStyle {
  readonly color: string;
  readonly shape: Shape;
}

/** Fixed styles of the IMF presets (names as in src/core/stars/imf-presets.ts). */
export const IMF_STYLES: Readonly<Record<string, SeriesStyle>> = Object.freeze({
  salpeter: { color: OKABE_ITO.blue, shape: 'circle' },
  chabrier: { color: OKABE_ITO.vermillion, shape: 'square' },
  kroupa: { color: OKABE_ITO.bluishGreen, shape: 'triangle' },
  'top-heavy-flat': { color: OKABE_ITO.reddishPurple, shape: 'diamond' },
  'top-heavy-cmb': { color: OKABE_ITO.orange, shape: 'cross' },
});

/** Colours and shapes left for custom IMFs: none of them is used by a preset. */
export const CUSTOM_COLORS: readonly string[] = [OKABE_ITO.skyBlue, OKABE_ITO.black, OKABE_ITO.yellow];
export const CUSTOM_SHAPES: readonly Shape[] = ['triangle-down', 'star', 'x'];

/** FNV-1a 32-bit hash of a string (Fowler, Noll & Vo; common practice, no source). */
export function fnv1a(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}

/** A custom spec in one canonical spelling (`custom:0.10:1.30:…` and `custom:0.1:1.3:…` are the same IMF). */
export function canonicalImfName(name: string): string {
  if (!name.startsWith('custom:')) return name;
  return 'custom:' + name.slice(7).split(':').map((p) => (p.trim() !== '' && Number.isFinite(Number(p)) ? String(Number(p)) : p.trim())).join(':');
}

/** The style of an IMF: fixed for a preset, derived from the spec for any other name. */
export function imfStyle(name: string): SeriesStyle {
  const preset = IMF_STYLES[name];
  if (preset) return preset;
  const h = fnv1a(canonicalImfName(name));
  return { color: CUSTOM_COLORS[h % CUSTOM_COLORS.length], shape: CUSTOM_SHAPES[Math.floor(h / CUSTOM_COLORS.length) % CUSTOM_SHAPES.length] };
}

/** A line style: colour and dash pattern in CSS px (empty = solid). */
export interface LineStyle {
  readonly color: string;
  readonly dash: readonly number[];
}

/** Dash patterns used across the figures; dotted uses round caps with short dashes. */
export const DASH = { solid: [] as number[], dashed: [8, 5], dotted: [1.5, 3], dashDot: [8, 3, 1.5, 3], longDash: [14, 4] } as const;

/** Fixed line styles of the mass functions (names as in src/core/halos/models.ts). */
export const MASS_FUNCTION_STYLES: Readonly<Record<string, LineStyle>> = Object.freeze({
  'sheth-tormen': { color: OKABE_ITO.blue, dash: DASH.solid },
  'press-schechter': { color: OKABE_ITO.vermillion, dash: DASH.dashed },
  tinker08: { color: OKABE_ITO.bluishGreen, dash: DASH.dotted },
  reed07: { color: OKABE_ITO.reddishPurple, dash: DASH.dashDot },
  jenkins01: { color: OKABE_ITO.orange, dash: DASH.longDash },
});

export function massFunctionStyle(name: string): LineStyle {
  return MASS_FUNCTION_STYLES[name] ?? { color: OKABE_ITO.skyBlue, dash: DASH.dashed };
}

export const VERDICT_COLORS: Record<string, string> = {
  'within budget': OKABE_ITO.bluishGreen,
  strained: OKABE_ITO.orange,
  'over budget': OKABE_ITO.vermillion,
};
