/**
 * Writes the print resolution into a PNG: a pHYs chunk (pixels per metre, unit 1 = metre) right after IHDR,
 * replacing any pHYs already there, so that a journal's or a word processor's layout places the image at
 * its intended size (PNG specification, W3C 2003, §11.3.5.3; chunk layout and CRC-32 in §5.3–5.4).
 */

let table: Uint32Array | undefined;

/** CRC-32 of the PNG specification (ISO 3309 polynomial 0xEDB88320, reflected; PNG spec Annex D). */
export function crc32(bytes: Uint8Array, start = 0, end = bytes.length): number {
  if (!table) {
    table = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      table[n] = c >>> 0;
    }
  }
  let c = 0xffffffff;
  for (let i = start; i < end; i++) c = table[(c ^ bytes[i]) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

const SIGNATURE = [137, 80, 78, 71, 13, 10, 26, 10];

/** Pixels per metre for a resolution in dots per inch (1 in = 0.0254 m). */
export const pixelsPerMetre = (dpi: number): number => Math.round(dpi / 0.0254);

/** Pixels across for a print width in mm at a resolution in dpi (1 in = 25.4 mm). */
export const pixelsFor = (mm: number, dpi: number): number => Math.round((mm / 25.4) * dpi);

/** The PNG bytes with a pHYs chunk for `dpi` after IHDR. Throws if the bytes are not a PNG. */
export function withDpi(png: Uint8Array, dpi: number): Uint8Array {
  if (png.length < 33 || SIGNATURE.some((b, i) => png[i] !== b)) throw new Error('not a PNG file');
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  const type = (at: number): string => String.fromCharCode(png[at + 4], png[at + 5], png[at + 6], png[at + 7]);
  if (type(8) !== 'IHDR') throw new Error('PNG without IHDR first');
  // Keep every chunk except an existing pHYs.
  const kept: Uint8Array[] = [];
  let at = 8;
  while (at + 12 <= png.length) {
    const len = view.getUint32(at);
    const end = at + 12 + len;
    if (end > png.length) throw new Error('truncated PNG chunk');
    if (type(at) !== 'pHYs') kept.push(png.subarray(at, end));
    at = end;
  }
  const phys = new Uint8Array(21);
  const pv = new DataView(phys.buffer);
  pv.setUint32(0, 9);
  phys.set([0x70, 0x48, 0x59, 0x73], 4); // "pHYs"
  const ppm = pixelsPerMetre(dpi);
  pv.setUint32(8, ppm);
  pv.setUint32(12, ppm);
  phys[16] = 1;
  pv.setUint32(17, crc32(phys, 4, 17));
  const out = new Uint8Array(8 + kept.reduce((a, c) => a + c.length, 0) + phys.length);
  out.set(SIGNATURE, 0);
  let o = 8;
  kept.forEach((c, i) => {
    out.set(c, o);
    o += c.length;
    if (i === 0) {
      out.set(phys, o);
      o += phys.length;
    }
  });
  return out;
}

/** Width, height (px) and pixels per metre (0 when absent) read from PNG bytes. */
export function pngInfo(png: Uint8Array): { width: number; height: number; ppmX: number; ppmY: number } {
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  let ppmX = 0;
  let ppmY = 0;
  for (let at = 8; at + 12 <= png.length; at += 12 + view.getUint32(at)) {
    if (String.fromCharCode(...png.subarray(at + 4, at + 8)) === 'pHYs') {
      ppmX = view.getUint32(at + 8);
      ppmY = view.getUint32(at + 12);
    }
  }
  return { width: view.getUint32(16), height: view.getUint32(20), ppmX, ppmY };
}
