import erf from '@stdlib/math-base-special-erf';

/**
 * A general initial mass function ξ(m) = dN/dm, built from contiguous segments that join
 * continuously: power laws ξ ∝ m^−α and log-normals in dN/dlog10 m ∝ exp[−(log m − log m_c)²/(2σ²)].
 * Normalised to 1 Msun formed between the lowest and highest segment limits.
 * Masses in Msun; N per Msun formed.
 */
export type ImfSegment =
  | { readonly kind: 'power'; readonly mLo: number; readonly mHi: number; readonly alpha: number }
  | { readonly kind: 'lognormal'; readonly mLo: number; readonly mHi: number; readonly mc: number; readonly sigma: number };

export interface Imf {
  readonly name: string;
  readonly segments: readonly ImfSegment[];
  /** Coefficient of each segment after continuity and normalisation. */
  readonly coeff: readonly number[];
  readonly mLow: number;
  readonly mUp: number;
}

/** Unnormalised shape of one segment, dN/dm. */
function shape(s: ImfSegment, m: number): number {
  if (s.kind === 'power') return m ** -s.alpha;
  const x = Math.log10(m) - Math.log10(s.mc);
  return Math.exp((-x * x) / (2 * s.sigma * s.sigma)) / (m * Math.LN10);
}

/** ∫_a^b m^k · shape dm for k = 0 (number) or 1 (mass), closed form. */
function segIntegral(s: ImfSegment, a: number, b: number, k: 0 | 1): number {
  if (!(b > a)) return 0;
  if (s.kind === 'power') {
    const e = k + 1 - s.alpha;
    return Math.abs(e) < 1e-12 ? Math.log(b / a) : (b ** e - a ** e) / e;
  }
  // ∫ 10^{k x} exp(−(x − μ)²/2σ²) dx over x = log10 m: complete the square, μ' = μ + kσ² ln10.
  const mu = Math.log10(s.mc);
  const sg = s.sigma;
  const shift = k * sg * sg * Math.LN10;
  const pre = Math.exp(k * Math.LN10 * mu + 0.5 * (k * sg * Math.LN10) ** 2);
  const xa = Math.log10(a);
  const xb = Math.log10(b);
  const r2 = Math.SQRT2 * sg;
  return pre * sg * Math.sqrt(Math.PI / 2) * (erf((xb - mu - shift) / r2) - erf((xa - mu - shift) / r2));
}

export function makeImf(name: string, segments: readonly ImfSegment[]): Imf {
  if (!segments.length) throw new RangeError(`IMF "${name}": needs at least one segment`);
  segments.forEach((s, i) => {
    if (!(s.mLo > 0) || !(s.mHi > s.mLo) || !Number.isFinite(s.mHi)) throw new RangeError(`IMF "${name}" segment ${i + 1}: needs 0 < m_lo < m_hi (got ${s.mLo}, ${s.mHi})`);
    if (s.mHi > 300 + 1e-9) throw new RangeError(`IMF "${name}" segment ${i + 1}: upper mass ${s.mHi} Msun exceeds 300 Msun (the stellar models stop there)`);
    if (s.mLo < 0.08 - 1e-12) throw new RangeError(`IMF "${name}" segment ${i + 1}: lower mass ${s.mLo} Msun is below the hydrogen-burning limit 0.08 Msun`);
    if (i > 0 && Math.abs(s.mLo - segments[i - 1].mHi) > 1e-12) throw new RangeError(`IMF "${name}" segment ${i + 1}: must start where segment ${i} ends (${segments[i - 1].mHi} Msun)`);
    if (s.kind === 'power' && !Number.isFinite(s.alpha)) throw new RangeError(`IMF "${name}" segment ${i + 1}: slope must be a finite number`);
    if (s.kind === 'lognormal' && !(s.sigma > 0 && s.mc > 0)) throw new RangeError(`IMF "${name}" segment ${i + 1}: log-normal needs m_c > 0 and σ > 0`);
  });
  const raw: number[] = [1];
  for (let i = 1; i < segments.length; i++) {
    const m = segments[i].mLo;
    raw.push((raw[i - 1] * shape(segments[i - 1], m)) / shape(segments[i], m));
  }
  let mass = 0;
  let number = 0;
  segments.forEach((s, i) => {
    mass += raw[i] * segIntegral(s, s.mLo, s.mHi, 1);
    number += raw[i] * segIntegral(s, s.mLo, s.mHi, 0);
  });
  if (!(raw.every((c) => Number.isFinite(c) && c > 0) && Number.isFinite(mass) && mass > 0 && Number.isFinite(number) && number > 0)) {
    throw new RangeError(`IMF "${name}": its number and mass integrals are not finite numbers (a slope is too steep for the mass range)`);
  }
  return {
    name,
    segments,
    coeff: raw.map((c) => c / mass),
    mLow: segments[0].mLo,
    mUp: segments[segments.length - 1].mHi,
  };
}

/** ξ(m) = dN/dm per Msun formed. */
export function imfDensity(imf: Imf, m: number): number {
  for (let i = 0; i < imf.segments.length; i++) {
    const s = imf.segments[i];
    if (m >= s.mLo && m <= s.mHi) return imf.coeff[i] * shape(s, m);
  }
  return 0;
}

function moment(imf: Imf, a: number, b: number, k: 0 | 1): number {
  let sum = 0;
  imf.segments.forEach((s, i) => {
    const lo = Math.max(a, s.mLo);
    const hi = Math.min(b, s.mHi);
    if (hi > lo) sum += imf.coeff[i] * segIntegral(s, lo, hi, k);
  });
  return sum;
}

/** Number of stars with a ≤ m ≤ b per Msun formed. */
export function imfNumber(imf: Imf, a = 0, b = Infinity): number {
  return moment(imf, a, b, 0);
}

/** Mass in stars with a ≤ m ≤ b per Msun formed (fraction of the mass formed). */
export function imfMass(imf: Imf, a = 0, b = Infinity): number {
  return moment(imf, a, b, 1);
}

/** Mean stellar mass, Msun. */
export function imfMeanMass(imf: Imf): number {
  return 1 / imfNumber(imf);
}
