/**
 * Opens an image file for lib/imaging (which does no I/O itself). A small file is read whole, as
 * before, so the common frame keeps its fast path; a large one is read by ranges through one file
 * descriptor, and sharp gets its path, so a 1.8 GB slide scan is never held in memory.
 */
import { closeSync, fstatSync, openSync, readFileSync, readSync } from "node:fs";
import type { ImageFile, ImageInput } from "../imaging";

/**
 * Files up to this size are read whole (design choice: a 4096² 16-bit frame is 32 MiB; whole
 * bytes cost one copy and keep the uncompressed-TIFF fast path reading in place).
 */
export const READ_WHOLE_MAX_BYTES = 64 * 1024 * 1024;

/** A file read by ranges; `close` releases its descriptor. */
export function openImageFile(file: string): ImageFile & { close(): void } {
  const fd = openSync(file, "r");
  const size = fstatSync(fd).size;
  return {
    path: file,
    size,
    read(offset, length) {
      const n = Math.max(0, Math.min(length, size - offset));
      const out = new Uint8Array(n);
      for (let got = 0; got < n;) {
        const r = readSync(fd, out, got, n - got, offset + got);
        if (r === 0) return out.subarray(0, got);
        got += r;
      }
      return out;
    },
    close: () => closeSync(fd),
  };
}

/** Runs `read` on the file's bytes (small file) or on the file read by ranges (large), closing it after. */
export async function withImageInput<T>(file: string, read: (input: ImageInput) => Promise<T>): Promise<T> {
  const opened = openImageFile(file);
  try {
    if (opened.size <= READ_WHOLE_MAX_BYTES) return await read(readFileSync(file));
    return await read(opened);
  } finally {
    opened.close();
  }
}
