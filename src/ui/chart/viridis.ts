/**
 * A perceptually uniform, colour-blind-safe sequential ramp: viridis (van der Walt & Smith 2015, the
 * matplotlib default), given by its ten evenly spaced stops (the stops of viridisLite's viridis(10), from
 * memory) and interpolated linearly in sRGB between them. Its CIE L* rises monotonically from dark
 * purple to yellow, so it reads in greyscale too.
 */
export const VIRIDIS_STOPS: readonly string[] = ['#440154', '#482878', '#3E4A89', '#31688E', '#26828E', '#1F9E89', '#35B779', '#6DCD59', '#B4DE2C', '#FDE725'];

const rgb = (hex: string): [number, number, number] => [parseInt(hex.slice(1, 3), 16), parseInt(hex.slice(3, 5), 16), parseInt(hex.slice(5, 7), 16)];
const STOPS = VIRIDIS_STOPS.map(rgb);
const hex2 = (v: number): string => Math.round(Math.min(255, Math.max(0, v))).toString(16).padStart(2, '0');

/** The ramp's colour at t ∈ [0, 1] (clamped; NaN gives the low end) as #rrggbb. */
export function viridis(t: number): string {
  const u = Number.isFinite(t) ? Math.min(1, Math.max(0, t)) * (STOPS.length - 1) : 0;
  const i = Math.min(STOPS.length - 2, Math.floor(u));
  const f = u - i;
  const a = STOPS[i];
  const b = STOPS[i + 1];
  return `#${hex2(a[0] + f * (b[0] - a[0]))}${hex2(a[1] + f * (b[1] - a[1]))}${hex2(a[2] + f * (b[2] - a[2]))}`;
}

/**
 * CIE 1976 L* of an sRGB colour (IEC 61966-2-1 transfer function, D65 luminance Y = 0.2126 R + 0.7152 G +
 * 0.0722 B of the linear channels; L* = 116 f(Y) − 16 with f the CIE cube root and its linear toe).
 */
export function lightness(hex: string): number {
  const lin = rgb(hex).map((c) => {
    const s = c / 255;
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  });
  const y = 0.2126 * lin[0] + 0.7152 * lin[1] + 0.0722 * lin[2];
  const f = y > (6 / 29) ** 3 ? Math.cbrt(y) : y / (3 * (6 / 29) ** 2) + 4 / 29;
  return 116 * f - 16;
}
