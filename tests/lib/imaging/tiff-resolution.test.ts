/**
 * A TIFF whose XResolution is no positive number (a rational with denominator 0, or 0) gives no
 * pixel size, with a note, rather than a pixel size of 0 µm/px. TIFF layout: TIFF 6.0
 * specification (Adobe 1992), sections 2 (IFD entries, RATIONAL = two LONGs) and 8 (tags 282, 296).
 */
import { describe, expect, it } from "vitest";
import { readPixelSize } from "@/lib/imaging";

/** A little-endian TIFF header with one IFD: XResolution = num/den (RATIONAL), ResolutionUnit = unit. */
function tiffWithResolution(num: number, den: number, unit = 3): Uint8Array {
  const b = new Uint8Array(8 + 2 + 2 * 12 + 4 + 8);
  const v = new DataView(b.buffer);
  v.setUint16(0, 0x4949, false); // "II"
  v.setUint16(2, 42, true);
  v.setUint32(4, 8, true);
  v.setUint16(8, 2, true); // two entries
  const ratAt = 8 + 2 + 2 * 12 + 4;
  // XResolution (282), RATIONAL (5), count 1, offset of the value
  v.setUint16(10, 282, true);
  v.setUint16(12, 5, true);
  v.setUint32(14, 1, true);
  v.setUint32(18, ratAt, true);
  // ResolutionUnit (296), SHORT (3), count 1, value inline
  v.setUint16(22, 296, true);
  v.setUint16(24, 3, true);
  v.setUint32(26, 1, true);
  v.setUint16(30, unit, true);
  v.setUint32(34, 0, true); // no next IFD
  v.setUint32(ratAt, num, true);
  v.setUint32(ratAt + 4, den, true);
  return b;
}

describe("TIFF resolution", () => {
  it("1/0 pixels per cm is treated as absent, with a note", () => {
    expect(readPixelSize(tiffWithResolution(1, 0), "tiff")).toEqual({
      pixelSizeUm: null,
      pixelSizeSource: null,
      pixelSizeNote: "The TIFF resolution (1/0 pixels per unit) is not a positive number, so it gives no pixel size.",
    });
    // A real resolution still gives its pixel size: 20000 px/cm = 0.5 µm/px (1 cm = 10⁴ µm).
    expect(readPixelSize(tiffWithResolution(20000, 1), "tiff")).toEqual({
      pixelSizeUm: 0.5,
      pixelSizeSource: "tiff-resolution",
      pixelSizeNote: null,
    });
  });

  it("0/1 is treated as absent, with a note", () => {
    expect(readPixelSize(tiffWithResolution(0, 1), "tiff").pixelSizeUm).toBeNull();
    expect(readPixelSize(tiffWithResolution(0, 1), "tiff").pixelSizeNote).toBe(
      "The TIFF resolution (0/1 pixels per unit) is not a positive number, so it gives no pixel size.",
    );
  });
});
