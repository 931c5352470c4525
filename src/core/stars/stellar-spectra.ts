import { starState, type Track } from './stellar-phases.js';
import { photosphereAt, stellarLnu, type Photosphere } from './stellar-atmosphere.js';

/**
 * L_ν of one star on each track (stellar-phases.ts) as a function of its mass, shared by every population of
 * one metallicity: computed exactly at grid masses log-spaced every 0.004 dex over 0.08–300 Msun (the IMF
 * limits), each node on first use, and interpolated linearly in (log m, ln L_ν) between nodes (linearly in
 * L_ν where a node has no light). Against evaluating each mass bin's own star, that changes a population's
 * L_ν by ≤ 1.4e-5 (measured, 1250 Å–1 μm, 3 Myr–1 Gyr; the test allows 1e-4). erg s⁻¹ Hz⁻¹, λ in μm.
 */
const LOG_M_MIN = Math.log10(0.08);
const LOG_M_MAX = Math.log10(300);
const STEP_DEX = 0.004;
const N_M = Math.ceil((LOG_M_MAX - LOG_M_MIN) / STEP_DEX) + 1;
const TRACKS: readonly Track[] = ['ms', 'post-red', 'post-blue'];
const MAX_ROWS = 512;

interface TrackData {
  readonly radius: Float64Array;
  readonly photospheres: (Photosphere | undefined)[];
  readonly rows: Map<number, Float64Array>;
}

export interface SpectralLibrary {
  readonly metallicity: number;
  /** L_ν of a star of mass m (Msun, 0.08–300) on a track at λ (μm). */
  lnu(track: Track, massMsun: number, lambdaUm: number): number;
}

const libraries = new Map<number, SpectralLibrary>();

export function spectralLibrary(metallicity: number): SpectralLibrary {
  const hit = libraries.get(metallicity);
  if (hit) return hit;
  const data = new Map<Track, TrackData>();
  for (const t of TRACKS) data.set(t, { radius: new Float64Array(N_M).fill(NaN), photospheres: new Array(N_M), rows: new Map() });
  const nodeLnu = (d: TrackData, track: Track, k: number, row: Float64Array, lambdaUm: number): number => {
    let v = row[k];
    if (Number.isNaN(v)) {
      let p = d.photospheres[k];
      if (!p) {
        const s = starState(track, 10 ** (LOG_M_MIN + k * STEP_DEX), metallicity);
        p = photosphereAt(s.tEffK, s.logG, metallicity);
        d.photospheres[k] = p;
        d.radius[k] = s.rRsun;
      }
      v = stellarLnu(d.radius[k], p, lambdaUm);
      row[k] = v;
    }
    return v;
  };
  const lib: SpectralLibrary = {
    metallicity,
    lnu: (track, massMsun, lambdaUm) => {
      const d = data.get(track)!;
      let row = d.rows.get(lambdaUm);
      if (!row) {
        if (d.rows.size >= MAX_ROWS) d.rows.clear();
        row = new Float64Array(N_M).fill(NaN);
        d.rows.set(lambdaUm, row);
      }
      const x = Math.min(Math.max((Math.log10(massMsun) - LOG_M_MIN) / STEP_DEX, 0), N_M - 1);
      const k = Math.min(Math.floor(x), N_M - 2);
      const f = x - k;
      const a = nodeLnu(d, track, k, row, lambdaUm);
      const b = nodeLnu(d, track, k + 1, row, lambdaUm);
      if (a > 0 && b > 0) return Math.exp((1 - f) * Math.log(a) + f * Math.log(b));
      return (1 - f) * a + f * b;
    },
  };
  libraries.set(metallicity, lib);
  return lib;
}
