/**
 * Input files as text. UTF-8 (with or without its BOM) and UTF-16 with a BOM (LE or BE) are read;
 * anything else is refused with a message naming the encoding problem, never read with replacement
 * characters (which would alter ids and notes). BOMs: EF BB BF (UTF-8), FF FE (UTF-16LE),
 * FE FF (UTF-16BE) (Unicode Standard, §23.8; common practice).
 */
export function decodeText(bytes: Uint8Array, what = 'the file'): { text: string; encoding: 'utf-8' | 'utf-16le' | 'utf-16be' } {
  let encoding: 'utf-8' | 'utf-16le' | 'utf-16be' = 'utf-8';
  let start = 0;
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) start = 3;
  else if (bytes[0] === 0xff && bytes[1] === 0xfe) [encoding, start] = ['utf-16le', 2];
  else if (bytes[0] === 0xfe && bytes[1] === 0xff) [encoding, start] = ['utf-16be', 2];
  else if (looksUtf16(bytes)) {
    throw new RangeError(`${what} looks like UTF-16 without a byte-order mark (every other byte is zero); save it as UTF-8, or as UTF-16 with a BOM`);
  }
  if (encoding !== 'utf-8' && (bytes.length - start) % 2) throw new RangeError(`${what} starts with a ${encoding.toUpperCase()} byte-order mark but has an odd number of bytes: it is damaged or not ${encoding.toUpperCase()}`);
  try {
    return { text: new TextDecoder(encoding, { fatal: true, ignoreBOM: true }).decode(bytes.subarray(start)), encoding };
  } catch {
    const at = encoding === 'utf-8' ? firstBadUtf8(bytes, start) : -1;
    throw new RangeError(
      encoding === 'utf-8'
        ? `${what} is not valid UTF-8 (byte 0x${bytes[at]?.toString(16).padStart(2, '0') ?? '??'} at offset ${at}, line ${lineOf(bytes, at)}); it may be Latin-1 or Windows-1252: save it as UTF-8`
        : `${what} is not valid ${encoding.toUpperCase()} (an unpaired surrogate); save it as UTF-8`,
    );
  }
}

/** No BOM, but zero bytes at every other position of the first 64 bytes: UTF-16 text of ASCII characters. */
function looksUtf16(b: Uint8Array): boolean {
  const n = Math.min(b.length, 64) & ~1;
  if (n < 4) return false;
  let evenZero = 0;
  let oddZero = 0;
  for (let i = 0; i < n; i += 2) {
    if (b[i] === 0) evenZero++;
    if (b[i + 1] === 0) oddZero++;
  }
  return evenZero === n / 2 || oddZero === n / 2;
}

function firstBadUtf8(b: Uint8Array, from: number): number {
  let lo = from;
  let hi = b.length;
  // Binary search for the shortest prefix that fails to decode as a stream (cut points inside a
  // character are allowed by { stream: true }).
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    try {
      new TextDecoder('utf-8', { fatal: true }).decode(b.subarray(from, mid), { stream: true });
      lo = mid;
    } catch {
      hi = mid;
    }
  }
  // The decoder fails at the byte after an unfinished sequence: report the sequence's lead byte.
  for (let k = 1; k <= 3 && lo - k >= from; k++) {
    const c = b[lo - k];
    if (c >= 0xc0) return lo - k;
    if (c < 0x80) break;
  }
  return lo;
}

function lineOf(b: Uint8Array, at: number): number {
  let line = 1;
  for (let i = 0; i < at && i < b.length; i++) if (b[i] === 0x0a) line++;
  return line;
}
