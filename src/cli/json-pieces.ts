/**
 * `JSON.stringify(value, null, 2)` as a sequence of pieces, so that a large value (the sample level's
 * points, one per galaxy; the record's copy of the sample) is written without ever building its whole
 * text. Joined, the pieces are exactly that text, each line after the first indented by `pad` (as a
 * value nested in a larger document). Arrays longer than `split` are written an element at a time,
 * strings longer than `text` characters a piece at a time (never between the halves of a surrogate
 * pair); smaller values whole.
 */
export interface PieceLimits {
  readonly split: number;
  readonly text: number;
}
const LIMITS: PieceLimits = { split: 64, text: 1 << 20 };

const nested = (json: string, pad: string): string => json.replace(/\n/g, `\n${pad}`);

/** Object members JSON.stringify keeps (it drops undefined, functions and symbols). */
function members(o: Record<string, unknown>): [string, unknown][] {
  return Object.entries(o).filter(([, v]) => v !== undefined && typeof v !== 'function' && typeof v !== 'symbol');
}

function isPlain(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v) && typeof (v as { toJSON?: unknown }).toJSON !== 'function';
}

/** True when the value holds an array or a string above the limits (only then is it worth splitting). */
function large(v: unknown, l: PieceLimits): boolean {
  if (typeof v === 'string') return v.length > l.text;
  if (Array.isArray(v)) return v.length > l.split || v.some((x) => large(x, l));
  if (isPlain(v)) return Object.values(v).some((x) => large(x, l));
  return false;
}

/** A long string as JSON, escaped a piece at a time. */
function* stringPieces(s: string, l: PieceLimits): Generator<string> {
  yield '"';
  for (let i = 0; i < s.length; ) {
    let j = Math.min(s.length, i + l.text);
    const c = s.charCodeAt(j - 1);
    // Not between the halves of a pair: one before it, or (a piece of one) one after it.
    if (j < s.length && c >= 0xd800 && c <= 0xdbff) j += j - 1 > i ? -1 : 1;
    yield JSON.stringify(s.slice(i, j)).slice(1, -1);
    i = j;
  }
  yield '"';
}

export function* jsonPieces(value: unknown, pad = '', l: PieceLimits = LIMITS): Generator<string> {
  if (!large(value, l)) {
    yield nested(JSON.stringify(value, null, 2), pad);
    return;
  }
  if (typeof value === 'string') {
    yield* stringPieces(value, l);
    return;
  }
  const inner = pad + '  ';
  if (Array.isArray(value)) {
    yield '[\n';
    for (let i = 0; i < value.length; i++) {
      yield inner;
      // JSON.stringify writes undefined and functions in arrays as null.
      const el = value[i] === undefined || typeof value[i] === 'function' || typeof value[i] === 'symbol' ? null : value[i];
      yield* jsonPieces(el, inner, l);
      yield i < value.length - 1 ? ',\n' : '\n';
    }
    yield `${pad}]`;
    return;
  }
  const entries = members(value as Record<string, unknown>);
  yield '{\n';
  for (let i = 0; i < entries.length; i++) {
    yield `${inner}${JSON.stringify(entries[i][0])}: `;
    yield* jsonPieces(entries[i][1], inner, l);
    yield i < entries.length - 1 ? ',\n' : '\n';
  }
  yield `${pad}}`;
}
