/**
 * Each Monte Carlo draw's cell in the population tables' (log age, log λ) grid, with its bilinear
 * weights: computed once per draw and read by every IMF's table, since all tables of a run share the
 * grid (MassToLightTable.gridPositionLog). From the fractional position (x, y): i = min(⌊x⌋, nAge − 2),
 * j = min(⌊y⌋, nLam − 2), cell = i·nLam + j, tx = x − i, ty = y − j (logMassToLightAt's own steps).
 */
export interface GridCells {
  readonly nAge: number;
  readonly nLam: number;
  readonly cell: Int32Array;
  readonly ageIndex: Int32Array;
  readonly tx: Float64Array;
  readonly ty: Float64Array;
}

/** The cells of the draws from..to − 1 at grid positions gx, gy, into out (the earlier entries are kept). */
export function fillGridCells(gx: Float64Array, gy: Float64Array, from: number, to: number, out: GridCells): void {
  const { nAge, nLam, cell, ageIndex, tx, ty } = out;
  for (let k = from; k < to; k++) {
    const x = gx[k];
    const y = gy[k];
    const i = Math.min(Math.floor(x), nAge - 2);
    const j = Math.min(Math.floor(y), nLam - 2);
    cell[k] = i * nLam + j;
    ageIndex[k] = i;
    tx[k] = x - i;
    ty[k] = y - j;
  }
}

/** log10 L_ν (erg s⁻¹ Hz⁻¹ per Msun formed) of a table at one draw's cell: logMassToLightAt's bilinear term, term for term. L = the table's logLnu. */
export function logLnuInCell(L: Float64Array, nLam: number, c: number, tx: number, ty: number): number {
  return (1 - tx) * ((1 - ty) * L[c] + ty * L[c + 1]) + tx * ((1 - ty) * L[c + nLam] + ty * L[c + nLam + 1]);
}

/** log10 of the surviving fraction 1 − R of a table at one draw's age cell a: logMassToLightAt's linear term. S = the table's logSurv. */
export function logSurvivingInCell(S: Float64Array, a: number, tx: number): number {
  return (1 - tx) * S[a] + tx * S[a + 1];
}

/**
 * log10 (M/L) (surviving Msun per erg s⁻¹ Hz⁻¹) of a table at one draw's cell: logMassToLightAt's
 * rule (the same number), without finding the cell again.
 */
export function logMassToLightInCell(L: Float64Array, S: Float64Array, nLam: number, a: number, c: number, tx: number, ty: number): number {
  return logSurvivingInCell(S, a, tx) - logLnuInCell(L, nLam, c, tx, ty);
}
