import type { GreyImage } from "./grey-image";
import { byteViewOf, isImageFile, type ByteView, type ImageInput } from "./image-input";
import { readPixelSize, type PixelSizeInfo } from "./pixel-size";
import { currentSpectrumExecutor, MIN_PARALLEL_BINS } from "../fft";

/** What decodeImage returns, for this one kind of file. */
export interface PlainTiff16 {
  image: GreyImage;
  info: PixelSizeInfo & {
    width: number;
    height: number;
    channels: 1;
    bitDepth: 16;
    format: "tiff";
    channelUsed: 0 | "luminance";
  };
}

/**
 * The fast path for the commonest microscope export: a single-page, uncompressed, 16-bit grey
 * TIFF in strips (TIFF 6.0 specification, Adobe 1992, sections 2, 3 and 7). Its samples are read
 * straight into Float32 (÷ 65535, exactly as the sharp path scales them), without sharp's copy
 * of the raw buffer: half the CPU time of the sharp path on a 4096² frame. Anything else (compression,
 * tiles, several pages, colour, a predictor, an orientation, damage) returns null and goes
 * through sharp, which also gives the errors.
 */
export function readPlainTiff16(
  input: ImageInput,
  channel: number | "luminance",
  maxPixels: number,
): PlainTiff16 | null {
  if (channel !== "luminance" && channel !== 0) return null;
  const layout = readPlainTiff16Layout(input);
  if (!layout) return null;
  const { le, width, height, offsets, rowsPerStrip } = layout;
  if (width * height > maxPixels) return null;
  // In shared memory: a second thread of the readout (lib/parallel/spectrum-threads.ts) reads its rows in place.
  const data = new Float32Array(new SharedArrayBuffer(4 * width * height));
  const scale = 1 / 65535;
  const convert = (fromStrip: number, toStrip: number) => {
    for (let s = fromStrip; s < toStrip; s++) {
      const rows = Math.min(rowsPerStrip, height - s * rowsPerStrip);
      const n = rows * width,
        at = offsets[s];
      const out = s * rowsPerStrip * width;
      // A file's strip is read by itself (a fresh, aligned array); bytes in memory are read in place.
      const bytes = isImageFile(input) ? input.read(at, 2 * n) : input;
      const from = isImageFile(input) ? 0 : at;
      if (le && (bytes.byteOffset + from) % 2 === 0 && littleEndianHost) {
        scaleSamples(new Uint16Array(bytes.buffer, bytes.byteOffset + from, n), data, out, scale);
      } else {
        const strip = new DataView(bytes.buffer, bytes.byteOffset + from, 2 * n);
        for (let i = 0; i < n; i++) data[out + i] = strip.getUint16(2 * i, le) * scale;
      }
    }
  };
  if (!convertOnTwoThreads(input, layout, data, scale, convert)) convert(0, offsets.length);
  const px = readPixelSize(input, "tiff");
  return {
    image: { width, height, data },
    info: { width, height, channels: 1, bitDepth: 16, format: "tiff", ...px, channelUsed: channel },
  };
}

/** Where the rows of a single-page, uncompressed, 16-bit grey TIFF in strips lie in the file. */
export interface PlainTiff16Layout {
  view: ByteView;
  le: boolean;
  width: number;
  height: number;
  /** Byte offset of each strip; every strip holds `rowsPerStrip` whole rows (the last one fewer), inside the file. */
  offsets: number[];
  rowsPerStrip: number;
}

/** The layout, or null unless the input is such a TIFF and every strip lies whole inside it. */
export function readPlainTiff16Layout(input: ImageInput): PlainTiff16Layout | null {
  const ifd = readFirstIfd(byteViewOf(input));
  if (!ifd) return null;
  const { view, le, entries } = ifd;
  const one = (tag: number, absent: number) => entries.get(tag)?.[0] ?? absent;
  const width = one(256, 0),
    height = one(257, 0);
  if (!(width > 0 && height > 0)) return null;
  const plain =
    one(258, 1) === 16 && // BitsPerSample
    one(259, 1) === 1 && // Compression: none
    one(262, -1) === 1 && // PhotometricInterpretation: BlackIsZero
    one(277, 1) === 1 && // SamplesPerPixel
    one(284, 1) === 1 && // PlanarConfiguration
    one(317, 1) === 1 && // Predictor
    one(339, 1) === 1 && // SampleFormat: unsigned integer
    one(274, 1) === 1 && // Orientation: rows top to bottom
    !entries.has(322); // TileWidth: tiled files go through sharp
  const offsets = entries.get(273),
    counts = entries.get(279);
  if (!plain || !offsets || !counts || offsets.length !== counts.length) return null;
  const rowsPerStrip = Math.min(one(278, height), height);
  if (offsets.length !== Math.ceil(height / rowsPerStrip)) return null;
  for (let s = 0; s < offsets.length; s++) {
    const n = Math.min(rowsPerStrip, height - s * rowsPerStrip) * width;
    if (counts[s] < 2 * n || offsets[s] + 2 * n > view.length) return null;
  }
  return { view, le, width, height, offsets, rowsPerStrip };
}

/**
 * One strip's samples into `data` from `out` on. A function per strip, not a loop inside the
 * reader: V8 keeps a small function optimised, where a long loop compiled on the fly was thrown
 * back to the baseline compiler at the reader's first exit after it.
 */
function scaleSamples(samples: Uint16Array, data: Float32Array, out: number, scale: number): void {
  for (let i = 0; i < samples.length; i++) data[out + i] = samples[i] * scale;
}

/** The second thread's part of the conversion: samples[i − base] × scale into data[i], i in [from, to). */
export interface ScaleSamplesJob {
  samples: Uint16Array;
  data: Float32Array;
  base: number;
  scale: number;
}

/** Values [from, to) of a ScaleSamplesJob (a row kernel, SpectrumExecutor.splitRows). */
export function runScaleSamples(job: ScaleSamplesJob, from: number, to: number): boolean {
  scaleSamples(job.samples.subarray(from - job.base, to - job.base), job.data, from, job.scale);
  return true;
}

/** The second thread's samples, in shared memory reused by the next frame of the same size (its page faults once). */
let kept: WeakRef<Uint16Array> | null = null;

/**
 * With a second thread (SpectrumExecutor.splitRows) and the file's bytes in memory, little-endian
 * and aligned: the later half of the strips is copied into shared memory and converted by the
 * other thread while this one converts the first half (by `convert`). False when it cannot: then
 * nothing is converted yet. The same multiplication either way, so the same values.
 */
function convertOnTwoThreads(
  input: ImageInput,
  { le, width, height, offsets, rowsPerStrip }: PlainTiff16Layout,
  data: Float32Array,
  scale: number,
  convert: (fromStrip: number, toStrip: number) => void,
): boolean {
  const executor = currentSpectrumExecutor();
  if (!executor?.splitRows || isImageFile(input) || !le || !littleEndianHost || offsets.length < 2) return false;
  if (width * height < MIN_PARALLEL_BINS || offsets.some((at) => (input.byteOffset + at) % 2 !== 0)) return false;
  const first = Math.ceil(offsets.length / 2);
  const base = first * rowsPerStrip * width,
    end = width * height;
  let samples = kept?.deref();
  if (!samples || samples.length !== end - base) {
    samples = new Uint16Array(new SharedArrayBuffer(2 * (end - base)));
    kept = new WeakRef(samples);
  }
  for (let s = first; s < offsets.length; s++) {
    const n = Math.min(rowsPerStrip, height - s * rowsPerStrip) * width;
    samples.set(new Uint16Array(input.buffer, input.byteOffset + offsets[s], n), s * rowsPerStrip * width - base);
  }
  const job: ScaleSamplesJob = { samples, data, base, scale };
  return (
    executor.splitRows("scale-samples", job, base, end, () => {
      convert(0, first);
      return true;
    }) !== null
  );
}

export const littleEndianHost = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;
const TYPE_SIZE: Record<number, number> = { 3: 2, 4: 4 };

/** The first IFD's SHORT and LONG entries (all values), or null unless it is the only IFD of a classic TIFF. */
function readFirstIfd(view: ByteView): { view: ByteView; le: boolean; entries: Map<number, number[]> } | null {
  if (view.length < 8) return null;
  const order = view.getUint16(0, false);
  if (order !== 0x4949 && order !== 0x4d4d) return null;
  const le = order === 0x4949;
  if (view.getUint16(2, le) !== 42) return null;
  const ifd = view.getUint32(4, le);
  if (ifd + 2 > view.length) return null;
  const count = view.getUint16(ifd, le);
  const end = ifd + 2 + count * 12;
  if (end + 4 > view.length || view.getUint32(end, le) !== 0) return null; // several pages: sharp's path
  const entries = new Map<number, number[]>();
  for (let e = 0; e < count; e++) {
    const at = ifd + 2 + e * 12;
    const type = view.getUint16(at + 2, le);
    const size = TYPE_SIZE[type];
    if (!size) continue;
    const n = view.getUint32(at + 4, le);
    const off = n * size <= 4 ? at + 8 : view.getUint32(at + 8, le);
    if (off + n * size > view.length) return null;
    const values: number[] = new Array<number>(n);
    for (let i = 0; i < n; i++)
      values[i] = size === 2 ? view.getUint16(off + 2 * i, le) : view.getUint32(off + 4 * i, le);
    entries.set(view.getUint16(at, le), values);
  }
  return { view, le, entries };
}
