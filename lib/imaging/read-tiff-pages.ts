/**
 * Walks the chain of image file directories (IFDs) of a classic TIFF: one IFD per page (TIFF 6.0
 * specification, Adobe 1992, section 2: "Image File Directory", the 4-byte offset of the next IFD).
 * Reads, per page, what is needed to pick a page and to tell a damaged one by its number before
 * any pixel is decoded: size, samples, bits, sample format, and whether its strips or tiles lie
 * inside the file. BigTIFF (version 43: 8-byte offsets and counts, 20-byte entries) is walked the
 * same way (BigTIFF format description, Aware Systems / libtiff, 2006).
 */
import { byteViewOf, type ImageInput } from "./image-input";

export interface TiffPage {
  width: number;
  height: number;
  samplesPerPixel: number;
  bitsPerSample: number;
  /** 1 unsigned integer, 2 signed integer, 3 IEEE float (TIFF 6.0 tag 339); absent means 1. */
  sampleFormat: number;
  /** Why this page cannot be read (e.g. its pixel data lies beyond the end of the file), or null. */
  damage: string | null;
}

export interface TiffPages {
  pages: TiffPage[];
  /** ImageDescription of the first page (OME-TIFF keeps its OME-XML there, ImageJ its hyperstack sizes). */
  description: string | null;
  /** Set when the chain of pages breaks: the pages after the last good one are not counted. */
  chainError: string | null;
}

/** Most pages walked; a stack of 100 000 planes is beyond any readout and a loop guard besides. */
export const MAX_TIFF_PAGES = 100_000;

const TYPE_SIZE: Record<number, number> = {
  1: 1,
  2: 1,
  3: 2,
  4: 4,
  5: 8,
  6: 1,
  7: 1,
  8: 2,
  9: 4,
  10: 8,
  11: 4,
  12: 8,
  16: 8,
  17: 8,
  18: 8,
};

/** Returns the pages, or null when the input is not a TIFF or BigTIFF (a file is read by ranges). */
export function readTiffPages(input: ImageInput): TiffPages | null {
  const view = byteViewOf(input);
  if (view.length < 8) return null;
  const order = view.getUint16(0, false);
  if (order !== 0x4949 && order !== 0x4d4d) return null;
  const le = order === 0x4949;
  const version = view.getUint16(2, le);
  if (version !== 42 && version !== 43) return null;
  const big = version === 43;
  if (big && view.length < 16) return null;
  // Offsets, entry counts and entry sizes differ between TIFF and BigTIFF; nothing else does here.
  const offsetAt = (at: number) => (big ? Number(view.getBigUint64(at, le)) : view.getUint32(at, le));
  const countAt = (at: number) => (big ? Number(view.getBigUint64(at, le)) : view.getUint16(at, le));
  const countSize = big ? 8 : 2,
    entrySize = big ? 20 : 12,
    inline = big ? 8 : 4;
  const pages: TiffPage[] = [];
  let description: string | null = null;
  let chainError: string | null = null;
  const seen = new Set<number>();
  for (let ifd = big ? offsetAt(8) : view.getUint32(4, le); ifd !== 0;) {
    const pageNo = pages.length + 1;
    if (seen.has(ifd) || pages.length >= MAX_TIFF_PAGES) {
      chainError = `The TIFF's list of pages loops back or exceeds ${MAX_TIFF_PAGES} pages after page ${pages.length}.`;
      break;
    }
    seen.add(ifd);
    if (ifd + countSize > view.length || ifd + countSize + countAt(ifd) * entrySize + inline > view.length) {
      chainError = `Page ${pageNo} of the TIFF is damaged: its header lies beyond the end of the file (the file may be truncated).`;
      break;
    }
    const count = countAt(ifd);
    const page: TiffPage = { width: 0, height: 0, samplesPerPixel: 1, bitsPerSample: 1, sampleFormat: 1, damage: null };
    const offsets: number[] = [],
      lengths: number[] = [];
    for (let e = 0; e < count; e++) {
      const at = ifd + countSize + e * entrySize;
      const tag = view.getUint16(at, le);
      const type = view.getUint16(at + 2, le);
      const n = big ? Number(view.getBigUint64(at + 4, le)) : view.getUint32(at + 4, le);
      const size = (TYPE_SIZE[type] ?? 0) * n;
      if (size === 0) continue;
      const valueAt = at + (big ? 12 : 8);
      const off = size <= inline ? valueAt : offsetAt(valueAt);
      if (off + size > view.length) {
        if (tag === 273 || tag === 279 || tag === 324 || tag === 325)
          page.damage = `Page ${pageNo} of the TIFF is damaged: its list of pixel blocks lies beyond the end of the file.`;
        continue;
      }
      const values = (): number[] => {
        const out: number[] = [];
        for (let i = 0; i < n; i++)
          out.push(
            type === 3
              ? view.getUint16(off + 2 * i, le)
              : type === 4
                ? view.getUint32(off + 4 * i, le)
                : view.getUint8(off + i),
          );
        return out;
      };
      if (tag === 256) page.width = values()[0];
      else if (tag === 257) page.height = values()[0];
      else if (tag === 258) page.bitsPerSample = values()[0];
      else if (tag === 277) page.samplesPerPixel = values()[0];
      else if (tag === 339) page.sampleFormat = values()[0];
      else if (tag === 273 || tag === 324) offsets.push(...values());
      else if (tag === 279 || tag === 325) lengths.push(...values());
      else if (tag === 270 && type === 2 && pages.length === 0)
        description = new TextDecoder("utf-8").decode(view.bytes(off, size)).replace(/\0+$/, "");
    }
    if (!page.damage && offsets.length > 0 && offsets.some((o, i) => o + (lengths[i] ?? 0) > view.length))
      page.damage = `Page ${pageNo} of the TIFF is damaged: its pixel data lies beyond the end of the file (the file may be truncated).`;
    pages.push(page);
    ifd = offsetAt(ifd + countSize + count * entrySize);
  }
  return { pages, description, chainError };
}
