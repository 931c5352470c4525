/**
 * `JSON.stringify(value, null, 2)` as a sequence of pieces, so that a large value (the sample level's
 * points, one per galaxy) is written without ever building its whole text. Joined, the pieces are
 * exactly that text, each line after the first indented by `pad` (as a value nested in a larger
 * document). Arrays longer than `SPLIT` are written an element at a time; smaller values whole.
 */
const SPLIT = 64;

const nested = (json: string, pad: string): string => json.replace(/\n/g, `\n${pad}`);

/** Object members JSON.stringify keeps (it drops undefined, functions and symbols). */
function members(o: Record<string, unknown>): [string, unknown][] {
  return Object.entries(o).filter(([, v]) => v !== undefined && typeof v !== 'function' && typeof v !== 'symbol');
}

function isPlain(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v) && typeof (v as { toJSON?: unknown }).toJSON !== 'function';
}

/** True when the value holds an array longer than SPLIT (only then is it worth splitting). */
function large(v: unknown): boolean {
  if (Array.isArray(v)) return v.length > SPLIT || v.some(large);
  if (isPlain(v)) return Object.values(v).some(large);
  return false;
}

export function* jsonPieces(value: unknown, pad = ''): Generator<string> {
  if (!large(value)) {
    yield nested(JSON.stringify(value, null, 2), pad);
    return;
  }
  const inner = pad + '  ';
  if (Array.isArray(value)) {
    yield '[\n';
    for (let i = 0; i < value.length; i++) {
      yield inner;
      // JSON.stringify writes undefined and functions in arrays as null.
      const el = value[i] === undefined || typeof value[i] === 'function' || typeof value[i] === 'symbol' ? null : value[i];
      yield* jsonPieces(el, inner);
      yield i < value.length - 1 ? ',\n' : '\n';
    }
    yield `${pad}]`;
    return;
  }
  const entries = members(value as Record<string, unknown>);
  yield '{\n';
  for (let i = 0; i < entries.length; i++) {
    yield `${inner}${JSON.stringify(entries[i][0])}: `;
    yield* jsonPieces(entries[i][1], inner);
    yield i < entries.length - 1 ? ',\n' : '\n';
  }
  yield `${pad}}`;
}
