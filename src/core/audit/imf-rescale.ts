import type { MassToLightTable } from '../stars/mass-to-light.js';
import { RESCALE_REST_UM } from './choices.js';

const LOG_RESCALE = Math.log10(RESCALE_REST_UM);

/**
 * Rescaling a reported stellar mass between IMFs at the same light (common practice, no source):
 * M⋆,target = M⋆,ref × (M/L_ν)_target / (M/L_ν)_ref, both surviving mass per L_ν at rest
 * RESCALE_REST_UM (0.4 μm) for the drawn population age and the run's SFH. The part that does not
 * depend on the target IMF is log10 M⋆,ref − log10 (M/L)_ref; adding the target's log10 (M/L) at the
 * same grid position gives log10 M⋆,target.
 */
export function rescalePosition(tab: MassToLightTable, log10AgeMyr: number): [number, number] {
  return tab.gridPositionLog(log10AgeMyr, LOG_RESCALE);
}

/** IMF-free base: log10 M⋆,ref − log10 (M/L)_ref at a grid position from rescalePosition. */
export function rescaleBase(log10MassRef: number, ref: MassToLightTable, x: number, y: number): number {
  return log10MassRef - ref.logMassToLightAt(x, y);
}

/** log10 M⋆ (Msun) under the target IMF, from a mass reported under the reference IMF. */
export function rescaleLogMass(log10MassRef: number, log10AgeMyr: number, ref: MassToLightTable, target: MassToLightTable): number {
  const [x, y] = rescalePosition(ref, log10AgeMyr);
  return rescaleBase(log10MassRef, ref, x, y) + target.logMassToLightAt(x, y);
}
