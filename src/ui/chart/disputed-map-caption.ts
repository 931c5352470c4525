import type { AuditResult } from '../../core/audit/index.js';
import type { DisputedMap } from '../../core/audit/disputed-map.js';
import { assumptions } from './figures.js';

/** Title of the fifth figure. */
export const mapTitle = (m: DisputedMap): string => `${m.id}: ε_req over redshift and IMF slope`;

/**
 * The caption of the fifth figure: what is mapped, how the galaxy is moved in redshift, the IMF family, the
 * ceiling's quantile and slices, the contour levels and how they are drawn, then every assumption of the audit.
 */
export function mapCaption(m: DisputedMap, r: AuditResult): string {
  const c = r.record.choices;
  const g = m.galaxy;
  const interval = g.z_lo !== undefined || g.z_hi !== undefined ? `; bar: its redshift interval ${g.z_lo ?? g.z}–${g.z_hi ?? g.z}` : '';
  const where = g.slope !== undefined ? `Ring: ${m.id} at z = ${g.z} and α = ${g.slope}, the slope of its headline IMF ${m.headline_imf}` : `Ring: ${m.id} at z = ${g.z}, along the top (its headline IMF ${m.headline_imf} has no single power-law slope there)`;
  return (
    `Colour: log10 of the median ε_req = M*/(f_b M_halo) of ${m.id} (viridis), for the IMF family custom:0.1:1.3:0.5:α:100 ` +
    `(dN/dM ∝ M^−1.3 from 0.1 to 0.5 Msun and M^−α from 0.5 to 100 Msun; α = ${m.slope[0]}–${m.slope[m.slope.length - 1]} in steps of ${(m.slope[1] - m.slope[0]).toFixed(2)}), ` +
    `over ${m.z.length} redshifts ${m.z[0].toFixed(2)}–${m.z[m.z.length - 1].toFixed(2)}, the galaxy moved in redshift as observed (the same band and flux, or its reported mass scaled by D_L²(1+z)); ` +
    `M_halo is the most massive halo expected at the ${(c.quantile * 100).toFixed(1)}% quantile in a slice Δz = ${c.sliceDz} at each redshift. ` +
    `Contours (marching squares on the grid): solid ε_req = 1, dashed ε_req = ε_ref = ${m.eps_ref}. ${where}${interval}. ` +
    `${c.growth ? `Growth: ${c.growth}. ` : ''}${assumptions(r)}`
  );
}
