/**
 * The one number syntax the project accepts from users (CLI flags, CSV cells, P(k) tables, IMF and
 * SFH specifications): plain decimal or exponent notation, an optional sign. No hexadecimal, no
 * thousands separators, no decimal comma, no "NaN" or "Infinity" words.
 */
const STRICT_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

export function isStrictNumber(text: string): boolean {
  return STRICT_NUMBER.test(text);
}

/** The value of a strict number (±Infinity when it overflows, e.g. 1e400); NaN when the text is not one. */
export function parseStrictNumber(text: string): number {
  return STRICT_NUMBER.test(text) ? Number(text) : Number.NaN;
}
