import { makeImf, type Imf, type ImfSegment } from './imf.js';
import { parseStrictNumber } from '../numeric/strict-number.js';

/** Salpeter 1955, ApJ 121, 161: ξ ∝ m^−2.35 over 0.1–100 Msun (the conventional limits). */
export const SALPETER_SEGMENTS: readonly ImfSegment[] = [{ kind: 'power', mLo: 0.1, mHi: 100, alpha: 2.35 }];

/** Kroupa 2001, MNRAS 322, 231, eq. 2: α = 1.3 (0.08–0.5 Msun), 2.3 (> 0.5 Msun); used over 0.1–100 Msun. */
export const KROUPA_SEGMENTS: readonly ImfSegment[] = [
  { kind: 'power', mLo: 0.1, mHi: 0.5, alpha: 1.3 },
  { kind: 'power', mLo: 0.5, mHi: 100, alpha: 2.3 },
];

/**
 * Chabrier 2003, PASP 115, 763, Table 1 (single stars): log-normal dN/dlog m with m_c = 0.079 Msun and
 * σ = 0.69 below 1 Msun, power law dN/dlog m ∝ m^−1.3 (ξ ∝ m^−2.3) above; joined continuously
 * (the published amplitudes 0.158 and 4.43e-2 agree with continuity to 0.5%); used over 0.1–100 Msun.
 */
export function chabrierSegments(mcMsun = 0.079, transitionMsun = 1): ImfSegment[] {
  return [
    { kind: 'lognormal', mLo: 0.1, mHi: transitionMsun, mc: mcMsun, sigma: 0.69 },
    { kind: 'power', mLo: transitionMsun, mHi: 100, alpha: 2.3 },
  ];
}

/**
 * Flat ("top-heavy") IMF used for starbursts in Baugh et al. 2005, MNRAS 356, 1191: dN/dln m ∝ m^0,
 * i.e. ξ ∝ m^−1, over 0.15–125 Msun (from memory: slope x = 0 and the mass limits as we recall them).
 */
export const TOP_HEAVY_FLAT_SEGMENTS: readonly ImfSegment[] = [{ kind: 'power', mLo: 0.15, mHi: 125, alpha: 1 }];

/** Gas temperature today for the CMB-heated IMF, K (typical local molecular-cloud value; common practice, no source). */
export const T_GAS_LOCAL_K = 20;

/**
 * Gas temperature at z with the CMB as a floor, in the form used for dust heated by the CMB
 * (da Cunha et al. 2013, ApJ 766, 13, eq. 12, with β = 2; from memory):
 * T(z)^(4+β) = T0^(4+β) + T_CMB,0^(4+β) [(1+z)^(4+β) − 1], K.
 */
export function gasTemperatureK(z: number, tcmb0K = 2.7255): number {
  const e = 6;
  return (T_GAS_LOCAL_K ** e + tcmb0K ** e * ((1 + z) ** e - 1)) ** (1 / e);
}

/**
 * CMB-heated IMF: Chabrier 2003 shape with its characteristic mass and 1-Msun transition scaled as the
 * Jeans mass at fixed pressure, M_J ∝ T² (Larson 1998, MNRAS 301, 569; the CMB-heating argument of
 * Jermyn, Steinhardt & Tout 2018, MNRAS 480, 4265). The exponent 2 and the gas temperature law are our
 * documented choices, not fitted values from those papers. Upper limit 100 Msun.
 */
export function cmbHeatedSegments(z: number, tcmb0K = 2.7255): ImfSegment[] {
  const scale = (gasTemperatureK(z, tcmb0K) / gasTemperatureK(0, tcmb0K)) ** 2;
  const transition = Math.min(1 * scale, 50);
  return chabrierSegments(0.079 * scale, transition);
}

export interface ImfPreset {
  readonly name: string;
  readonly label: string;
  readonly topHeavy: boolean;
  readonly source: string;
  /** The IMF at a redshift (only the CMB-heated preset depends on it). */
  at(z: number): Imf;
}

export const IMF_PRESETS: readonly ImfPreset[] = [
  { name: 'salpeter', label: 'Salpeter', topHeavy: false, source: 'Salpeter 1955, ApJ 121, 161 (0.1–100 Msun)', at: () => makeImf('salpeter', SALPETER_SEGMENTS) },
  { name: 'kroupa', label: 'Kroupa', topHeavy: false, source: 'Kroupa 2001, MNRAS 322, 231, eq. 2 (0.1–100 Msun)', at: () => makeImf('kroupa', KROUPA_SEGMENTS) },
  { name: 'chabrier', label: 'Chabrier', topHeavy: false, source: 'Chabrier 2003, PASP 115, 763, Table 1, single stars (0.1–100 Msun)', at: () => makeImf('chabrier', chabrierSegments()) },
  {
    name: 'top-heavy-flat',
    label: 'Flat top-heavy',
    topHeavy: true,
    source: 'Baugh et al. 2005, MNRAS 356, 1191: dN/dln m = const over 0.15–125 Msun (from memory)',
    at: () => makeImf('top-heavy-flat', TOP_HEAVY_FLAT_SEGMENTS),
  },
  {
    name: 'top-heavy-cmb',
    label: 'CMB-heated',
    topHeavy: true,
    source: 'Chabrier 2003 shape with m_c ∝ T_gas(z)², T_gas floored by the CMB (Larson 1998, MNRAS 301, 569; Jermyn et al. 2018, MNRAS 480, 4265)',
    at: (z) => makeImf('top-heavy-cmb', cmbHeatedSegments(z)),
  },
];

export const IMF_NAMES = IMF_PRESETS.map((p) => p.name);

/**
 * Resolves an IMF name at redshift z. `custom:m0:α1:m1:α2:m2…` is a user power law with slopes α_i
 * between the listed masses (Msun), e.g. `custom:0.1:1.3:0.5:2.3:100`.
 */
export function resolveImf(name: string, z = 0): Imf {
  const preset = IMF_PRESETS.find((p) => p.name === name);
  if (preset) return preset.at(z);
  if (name.startsWith('custom:')) return parseCustomImf(name);
  throw new RangeError(`unknown IMF "${name}" (allowed: ${IMF_NAMES.join(', ')}, or custom:m0:α1:m1:…)`);
}

export function isTopHeavy(name: string): boolean {
  return IMF_PRESETS.find((p) => p.name === name)?.topHeavy ?? false;
}

export function parseCustomImf(spec: string): Imf {
  const parts = spec.slice('custom:'.length).split(':');
  if (parts.length < 3 || parts.length % 2 === 0) {
    throw new RangeError(`custom IMF "${spec}": write custom:m0:α1:m1[:α2:m2…] (masses in Msun, slopes of dN/dm ∝ m^−α)`);
  }
  const v = parts.map((p, i) => {
    const x = parseStrictNumber(p);
    if (!Number.isFinite(x)) throw new RangeError(`custom IMF "${spec}": item ${i + 1} ("${p}") is not a number`);
    return x;
  });
  const segs: ImfSegment[] = [];
  for (let i = 1; i < v.length; i += 2) segs.push({ kind: 'power', mLo: v[i - 1], mHi: v[i + 1], alpha: v[i] });
  return makeImf(spec, segs);
}
