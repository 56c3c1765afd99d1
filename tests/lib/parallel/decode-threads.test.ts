/**
 * The plain 16-bit TIFF reader with a second thread converting the later half of the strips
 * (SpectrumExecutor.splitRows) must give one thread's values bit for bit: each sample is the same
 * multiplication on either thread (the requirement "identical numbers on one and two threads";
 * common practice, no source). Frames above 2²⁰ px, the size from which work is split.
 */
import { afterAll, describe, expect, it } from "vitest";
import { setSpectrumExecutor } from "@/lib/fft";
import { encodeTiff16 } from "@/lib/imaging";
import { readPlainTiff16 } from "@/lib/imaging/read-plain-tiff16";
import { createSpectrumThreads } from "@/lib/parallel/spectrum-threads";
import { createRng } from "@/lib/synthetic";

const threads = createSpectrumThreads();
afterAll(() => {
  setSpectrumExecutor(null);
  threads.dispose();
});

const bits = (a: Float32Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength);

describe("the plain 16-bit TIFF reader on two threads", () => {
  it("gives one thread's values bit for bit, twice over its reused shared samples", async () => {
    const width = 1100,
      height = 1030;
    const rng = createRng(3);
    const data = Float32Array.from({ length: width * height }, () => rng.uniform());
    const bytes = await encodeTiff16({ width, height, data }, { pixelSizeUm: 0.5 });
    setSpectrumExecutor(null);
    const one = readPlainTiff16(bytes, "luminance", 1e9)!;
    const kernels: string[] = [];
    setSpectrumExecutor({
      halfPower: threads.halfPower,
      splitRows: (...args) => (kernels.push(args[0]), threads.splitRows(...args)),
    });
    const two = readPlainTiff16(bytes, "luminance", 1e9)!;
    const again = readPlainTiff16(bytes, "luminance", 1e9)!;
    setSpectrumExecutor(null);
    expect(kernels).toEqual(["scale-samples", "scale-samples"]);
    expect(one.image.data.some((v) => v > 0)).toBe(true);
    expect(bits(two.image.data).equals(bits(one.image.data))).toBe(true);
    expect(bits(again.image.data).equals(bits(one.image.data))).toBe(true);
    expect(two.image.data.buffer).toBeInstanceOf(SharedArrayBuffer);
  });
});
