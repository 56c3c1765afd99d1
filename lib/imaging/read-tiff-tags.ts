/**
 * Reads the few baseline tags of a classic TIFF's first IFD that sharp does not expose exactly:
 * resolution (as the stored rationals, not sharp's rounded DPI) and ImageDescription (where
 * OME-TIFF keeps its XML). TIFF 6.0 specification (Adobe 1992), sections 2 and 8.
 */
import { byteViewOf, type ImageInput } from "./image-input";

export interface TiffTags {
  width?: number;
  height?: number;
  bitsPerSample?: number;
  samplesPerPixel?: number;
  /** Pixels per resolution unit, X direction; NaN when the stored rational has denominator 0. */
  xResolution?: number;
  /** The X resolution as stored, e.g. "1/0" (for messages). */
  xResolutionText?: string;
  yResolution?: number;
  /** 1 none, 2 inch, 3 centimetre (TIFF 6.0 tag 296); absent means 2. */
  resolutionUnit?: number;
  imageDescription?: string;
}

const TAG = {
  width: 256,
  height: 257,
  bits: 258,
  description: 270,
  spp: 277,
  xres: 282,
  yres: 283,
  unit: 296,
} as const;
const TYPE_SIZE: Record<number, number> = { 1: 1, 2: 1, 3: 2, 4: 4, 5: 8, 6: 1, 7: 1, 8: 2, 9: 4, 10: 8, 11: 4, 12: 8 };

/** Returns the tags, or null when the input is not a readable classic TIFF (BigTIFF included); a file is read by ranges. */
export function readTiffTags(input: ImageInput): TiffTags | null {
  const view = byteViewOf(input);
  if (view.length < 8) return null;
  const order = view.getUint16(0, false);
  if (order !== 0x4949 && order !== 0x4d4d) return null;
  const le = order === 0x4949;
  if (view.getUint16(2, le) !== 42) return null;
  const ifd = view.getUint32(4, le);
  if (ifd + 2 > view.length) return null;
  const count = view.getUint16(ifd, le);
  if (ifd + 2 + count * 12 > view.length) return null;
  const tags: TiffTags = {};
  for (let e = 0; e < count; e++) {
    const at = ifd + 2 + e * 12;
    const tag = view.getUint16(at, le);
    const type = view.getUint16(at + 2, le);
    const n = view.getUint32(at + 4, le);
    const size = (TYPE_SIZE[type] ?? 0) * n;
    if (size === 0) continue;
    const off = size <= 4 ? at + 8 : view.getUint32(at + 8, le);
    if (off + size > view.length) continue;
    const num = (): number =>
      type === 3
        ? view.getUint16(off, le)
        : type === 4
          ? view.getUint32(off, le)
          : type === 1
            ? view.getUint8(off)
            : Number.NaN;
    // A rational with denominator 0 is no number (1/0 would read as Infinity, then a pixel size of 0).
    const rational = (): number =>
      type === 5
        ? view.getUint32(off + 4, le) === 0
          ? Number.NaN
          : view.getUint32(off, le) / view.getUint32(off + 4, le)
        : num();
    const rationalText = (): string =>
      type === 5 ? `${view.getUint32(off, le)}/${view.getUint32(off + 4, le)}` : String(num());
    switch (tag) {
      case TAG.width:
        tags.width = num();
        break;
      case TAG.height:
        tags.height = num();
        break;
      case TAG.bits:
        tags.bitsPerSample = num();
        break;
      case TAG.spp:
        tags.samplesPerPixel = num();
        break;
      case TAG.xres:
        tags.xResolution = rational();
        tags.xResolutionText = rationalText();
        break;
      case TAG.yres:
        tags.yResolution = rational();
        break;
      case TAG.unit:
        tags.resolutionUnit = num();
        break;
      case TAG.description:
        if (type === 2)
          tags.imageDescription = new TextDecoder("utf-8").decode(view.bytes(off, size)).replace(/\0+$/, "");
        break;
    }
  }
  return tags;
}
