import { imfMass } from '../stars/imf.js';
import { resolveImf } from '../stars/imf-presets.js';

/**
 * The audit turns rest-frame UV-to-1 μm light into mass, and at young ages that light comes from
 * stars above ~8 Msun (common practice, no source). An IMF with (almost) no mass there gives no
 * usable mass-to-light ratio: the audit needs at least this fraction of the mass formed above 8 Msun.
 * Salpeter 0.1–100 Msun has ~0.14; a slope of α = 5 from 0.1 Msun still has ~2e-6.
 */
export const MIN_MASS_FRACTION_ABOVE_8_MSUN = 1e-6;
const UV_STAR_MSUN = 8;

/**
 * Why an IMF name cannot be used in an audit, or undefined: it must be a preset name or a custom
 * power law that the stellar code accepts (finite moments, 0.08–300 Msun; see makeImf), with
 * enough massive stars to make the light the audit converts (MIN_MASS_FRACTION_ABOVE_8_MSUN).
 */
export function imfProblem(name: string): string | undefined {
  try {
    const imf = resolveImf(name, 0);
    const f = imf.mUp > UV_STAR_MSUN ? imfMass(imf, UV_STAR_MSUN, imf.mUp) : 0;
    if (!(f >= MIN_MASS_FRACTION_ABOVE_8_MSUN)) {
      return `IMF "${name}" puts ${f === 0 ? 'no' : f.toExponential(1) + ' of its'} mass in stars above ${UV_STAR_MSUN} Msun; the audit needs at least ${MIN_MASS_FRACTION_ABOVE_8_MSUN} there (they make the rest-frame UV light it converts into mass)`;
    }
    return undefined;
  } catch (e) {
    return (e as Error).message;
  }
}

export const isKnownImf = (name: string): boolean => imfProblem(name) === undefined;
