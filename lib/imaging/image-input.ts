/**
 * What an image is read from: its bytes in memory, or a file read by ranges. A slide scan of
 * 30 000 × 30 000 px at 16 bits is 1.8 GB, more than a readout may hold (issue 13: ≤ 1 GiB), so a
 * large file is never read whole: sharp gets its path (libvips reads only the strips or tiles an
 * extract needs) and the TIFF header readers read the ranges they need through `read`. This folder
 * does no I/O itself: the caller opens the file (lib/workers/image-file.ts) and closes it.
 */
export interface ImageFile {
  /** The file's path, handed to sharp. */
  path: string;
  /** Its size in bytes. */
  size: number;
  /** `length` bytes from `offset` (fewer at the end of the file), in a fresh, aligned array. */
  read(offset: number, length: number): Uint8Array;
}

export type ImageInput = Uint8Array | ImageFile;

export const isImageFile = (input: ImageInput): input is ImageFile => !(input instanceof Uint8Array);

/** What sharp is given: a Buffer over the same memory, or the file's path. */
export function sharpInput(input: ImageInput): Buffer | string {
  return isImageFile(input) ? input.path : Buffer.from(input.buffer, input.byteOffset, input.byteLength);
}

/** The first `length` bytes (the whole of a small input): enough for a PNG's chunks before its pixels. */
export function headOf(input: ImageInput, length: number): Uint8Array {
  return isImageFile(input) ? input.read(0, Math.min(length, input.size)) : input;
}

/** The DataView methods the TIFF readers use, over bytes in memory or a file read by ranges. */
export interface ByteView {
  length: number;
  getUint8(at: number): number;
  getUint16(at: number, le?: boolean): number;
  getUint32(at: number, le?: boolean): number;
  getBigUint64(at: number, le?: boolean): bigint;
  /** A copy (file) or a view (memory) of `length` bytes from `at`. */
  bytes(at: number, length: number): Uint8Array;
}

/** Bytes of a file are cached in pages of this size (design choice: one read covers a TIFF page's header). */
const PAGE_BYTES = 64 * 1024;
/** Pages kept (design choice: 4 MiB, enough for the offsets of a few thousand strips). */
const PAGES_KEPT = 64;

export function byteViewOf(input: ImageInput): ByteView {
  if (!isImageFile(input)) {
    const view = new DataView(input.buffer, input.byteOffset, input.byteLength);
    return {
      length: input.length,
      getUint8: (at) => view.getUint8(at),
      getUint16: (at, le) => view.getUint16(at, le),
      getUint32: (at, le) => view.getUint32(at, le),
      getBigUint64: (at, le) => view.getBigUint64(at, le),
      bytes: (at, length) => input.subarray(at, at + length),
    };
  }
  const pages = new Map<number, DataView>();
  const pageAt = (p: number): DataView => {
    let page = pages.get(p);
    if (!page) {
      const b = input.read(p * PAGE_BYTES, PAGE_BYTES);
      page = new DataView(b.buffer, b.byteOffset, b.byteLength);
      if (pages.size >= PAGES_KEPT) pages.delete(pages.keys().next().value!);
      pages.set(p, page);
    }
    return page;
  };
  // A value inside one page is read from the cache; one across a page boundary by itself.
  const within = (at: number, n: number): { view: DataView; at: number } => {
    if (at < 0 || at + n > input.size) throw new RangeError(`Offset ${at} is outside the file.`);
    const p = Math.floor(at / PAGE_BYTES);
    if (Math.floor((at + n - 1) / PAGE_BYTES) === p) return { view: pageAt(p), at: at - p * PAGE_BYTES };
    const b = input.read(at, n);
    return { view: new DataView(b.buffer, b.byteOffset, b.byteLength), at: 0 };
  };
  return {
    length: input.size,
    getUint8: (at) => {
      const w = within(at, 1);
      return w.view.getUint8(w.at);
    },
    getUint16: (at, le) => {
      const w = within(at, 2);
      return w.view.getUint16(w.at, le);
    },
    getUint32: (at, le) => {
      const w = within(at, 4);
      return w.view.getUint32(w.at, le);
    },
    getBigUint64: (at, le) => {
      const w = within(at, 8);
      return w.view.getBigUint64(w.at, le);
    },
    bytes: (at, length) => input.read(at, length),
  };
}
