/**
 * Writes an uncompressed, single-page, 16-bit grey TIFF of any size to a file, strip by strip, so a
 * test can make a slide-scan-sized image (20 000 × 20 000 px = 800 MB) without holding it: only one
 * strip is in memory at a time. Layout per TIFF 6.0 (Adobe 1992), sections 2, 3 and 7: the header,
 * the strips, then the one IFD with StripOffsets and StripByteCounts as LONG arrays.
 */
import { closeSync, openSync, writeSync } from "node:fs";

/** Rows per strip (design choice: ~0.6 MiB strips at 20 000 px). */
const ROWS_PER_STRIP = 16;

/**
 * @param sample the 16-bit value at (x, y); called row by row
 * @param pixelSizeUm written as XResolution/YResolution in pixels per centimetre (ResolutionUnit 3)
 */
export function writePlainTiff16(
  file: string,
  width: number,
  height: number,
  fillRow: (y: number, row: Uint16Array) => void,
  pixelSizeUm: number,
): void {
  const strips = Math.ceil(height / ROWS_PER_STRIP);
  const fd = openSync(file, "w");
  try {
    const header = Buffer.alloc(8);
    header.write("II", 0, "latin1");
    header.writeUInt16LE(42, 2);
    const dataBytes = 2 * width * height;
    const ifdAt = 8 + dataBytes + ((8 + dataBytes) % 2);
    header.writeUInt32LE(ifdAt, 4);
    writeSync(fd, header, 0, 8, 0);
    const offsets: number[] = [],
      counts: number[] = [];
    let at = 8;
    for (let s = 0; s < strips; s++) {
      const rows = Math.min(ROWS_PER_STRIP, height - s * ROWS_PER_STRIP);
      const strip = new Uint16Array(rows * width);
      for (let r = 0; r < rows; r++) fillRow(s * ROWS_PER_STRIP + r, strip.subarray(r * width, (r + 1) * width));
      const bytes = Buffer.from(strip.buffer, strip.byteOffset, strip.byteLength);
      writeSync(fd, bytes, 0, bytes.length, at);
      offsets.push(at);
      counts.push(bytes.length);
      at += bytes.length;
    }
    // Entries in ascending tag order (TIFF 6.0 section 2); arrays and rationals after the IFD.
    const entries: Array<[tag: number, type: number, values: number[]]> = [
      [256, 4, [width]],
      [257, 4, [height]],
      [258, 3, [16]],
      [259, 3, [1]], // no compression
      [262, 3, [1]], // BlackIsZero
      [273, 4, offsets],
      [277, 3, [1]],
      [278, 4, [ROWS_PER_STRIP]],
      [279, 4, counts],
      [282, 5, [Math.round(1e4 / pixelSizeUm), 1]], // px per cm
      [283, 5, [Math.round(1e4 / pixelSizeUm), 1]],
      [296, 3, [3]], // centimetre
    ];
    const ifdBytes = 2 + entries.length * 12 + 4;
    let extraAt = ifdAt + ifdBytes;
    const ifd = Buffer.alloc(ifdBytes);
    const extras: Buffer[] = [];
    ifd.writeUInt16LE(entries.length, 0);
    entries.forEach(([tag, type, values], i) => {
      const e = 2 + i * 12;
      const size = type === 3 ? 2 : 4;
      const n = type === 5 ? values.length / 2 : values.length;
      ifd.writeUInt16LE(tag, e);
      ifd.writeUInt16LE(type, e + 2);
      ifd.writeUInt32LE(n, e + 4);
      const body = Buffer.alloc(values.length * size);
      values.forEach((v, j) => (size === 2 ? body.writeUInt16LE(v, 2 * j) : body.writeUInt32LE(v, 4 * j)));
      if (body.length <= 4) body.copy(ifd, e + 8);
      else {
        ifd.writeUInt32LE(extraAt, e + 8);
        extras.push(body);
        extraAt += body.length;
      }
    });
    writeSync(fd, Buffer.concat([ifd, ...extras]), 0, undefined, ifdAt);
  } finally {
    closeSync(fd);
  }
}
