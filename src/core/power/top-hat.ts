/**
 * Fourier transform of a real-space spherical top hat, W(x) = 3 (sin x − x cos x)/x³, and its
 * derivative dW/dx = [9x cos x + 3(x² − 3) sin x]/x⁴ (standard; e.g. Peebles 1980 §27).
 * Below x = 1e-2 the Taylor series 1 − x²/10 + x⁴/280 avoids cancellation.
 */
export function topHat(x: number): number {
  if (x < 1e-2) {
    const x2 = x * x;
    return 1 - x2 / 10 + (x2 * x2) / 280;
  }
  return (3 * (Math.sin(x) - x * Math.cos(x))) / (x * x * x);
}

export function topHatDeriv(x: number): number {
  if (x < 1e-2) return -x / 5 + (x * x * x) / 70;
  const s = Math.sin(x);
  const c = Math.cos(x);
  return (9 * x * c + 3 * (x * x - 3) * s) / (x * x * x * x);
}
