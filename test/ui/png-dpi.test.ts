import { describe, expect, it } from 'vitest';
import { crc32 as zlibCrc32, deflateSync } from 'node:zlib';
import { crc32, pixelsFor, pixelsPerMetre, pngInfo, withDpi } from '../../src/ui/chart/png-dpi.js';

/** A PNG of w × h grey pixels built with Node's zlib (independent of the code under test). */
function tinyPng(w: number, h: number): Uint8Array {
  const chunk = (type: string, data: Buffer): Buffer => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const td = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(zlibCrc32(td));
    return Buffer.concat([len, td, crc]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(w, 0);
  ihdr.writeUInt32BE(h, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 0; // greyscale
  const raw = Buffer.alloc((w + 1) * h, 0x80);
  for (let y = 0; y < h; y++) raw[y * (w + 1)] = 0;
  return new Uint8Array(Buffer.concat([Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw)), chunk('IEND', Buffer.alloc(0))]));
}

describe('png-dpi', () => {
  it('crc32 matches the CRC-32 check value of "123456789" (0xCBF43926, the CRC catalogue) and Node zlib', () => {
    expect(crc32(new TextEncoder().encode('123456789'))).toBe(0xcbf43926);
    const b = new Uint8Array(1000).map((_, i) => (i * 37) & 255);
    expect(crc32(b)).toBe(zlibCrc32(b));
  });

  it('88 mm and 180 mm at 300 dpi are 1039 and 2126 pixels across (1 in = 25.4 mm); 300 dpi = 11811 px/m', () => {
    expect(pixelsFor(88, 300)).toBe(1039);
    expect(pixelsFor(180, 300)).toBe(2126);
    expect(pixelsPerMetre(300)).toBe(11811);
  });

  it('withDpi puts one valid pHYs chunk right after IHDR, keeps every other chunk, and replaces an old one', () => {
    const png = tinyPng(3, 2);
    const out = withDpi(png, 300);
    expect(out.length).toBe(png.length + 21);
    const type = String.fromCharCode(...out.subarray(37, 41));
    expect(type).toBe('pHYs');
    const view = new DataView(out.buffer);
    expect(view.getUint32(33)).toBe(9);
    expect(view.getUint32(50)).toBe(zlibCrc32(out.subarray(37, 50)));
    expect(pngInfo(out)).toEqual({ width: 3, height: 2, ppmX: 11811, ppmY: 11811 });
    const again = withDpi(out, 600);
    expect(again.length).toBe(out.length);
    expect(pngInfo(again).ppmX).toBe(23622);
    expect(Buffer.from(again.subarray(png.length - 12 + 21))).toEqual(Buffer.from(png.subarray(png.length - 12)));
    expect(() => withDpi(new Uint8Array(40), 300)).toThrow(/not a PNG/);
  });
});
