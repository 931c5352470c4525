/**
 * A number as an input shows it: six significant digits (Ω_b = 0.0489698…, not 16 digits), whole
 * numbers and large values in full. Display only: the choice itself keeps the exact value until the
 * field is edited.
 */
export function shortNumber(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (Number.isInteger(x) || Math.abs(x) >= 1e6) return String(x);
  return String(Number(x.toPrecision(6)));
}

/** Whether the input shows a rounded value (then the exact one is worth saying). */
export const isRounded = (x: number): boolean => shortNumber(x) !== String(x);
