/**
 * The readout with a second thread (SpectrumExecutor: the FFT, the whole-frame passes, the blurs, the texture map, the radial average)
 * must give one thread's numbers to the last bit: every row and column is computed by the same
 * function on either thread, and sums across rows are added in row order (the radial average's in
 * two fixed halves, on one thread too) (the requirement
 * "identical numbers on one and two threads"; common practice, no source).
 */
import { afterAll, describe, expect, it } from "vitest";
import { setSpectrumExecutor, type RowKernel, type SpectrumExecutor } from "@/lib/fft";
import { createSpectrumThreads } from "@/lib/parallel/spectrum-threads";
import { readWavelength } from "@/lib/readout";
import { blur } from "@/lib/readout/box-blur";
import { computeTextureMap } from "@/lib/readout/texture-map";
import { createRng, makeTissueFrame } from "@/lib/synthetic";

const threads = createSpectrumThreads();
afterAll(() => {
  setSpectrumExecutor(null);
  threads.dispose();
});

const bits = (a: Float32Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength);

/** The threads' executor, noting each row kernel it splits. */
function counting(kernels: RowKernel[]): SpectrumExecutor {
  return {
    halfPower: threads.halfPower,
    splitRows: (...args) => (kernels.push(args[0]), threads.splitRows(...args)),
  };
}

describe("the readout on two threads", () => {
  // Odd sizes, so the rows and columns do not halve evenly; radii from 1 px to more than half a side.
  it.each([1.5, 25.6, 700])("blurs bit for bit as one thread does, σ = %s px", (sigmaPx) => {
    const width = 1031,
      height = 1025;
    const rng = createRng(11);
    const data = Float32Array.from({ length: width * height }, () => rng.normal());
    setSpectrumExecutor(null);
    const one = blur(data, width, height, sigmaPx);
    const kernels: RowKernel[] = [];
    setSpectrumExecutor(counting(kernels));
    const two = blur(data, width, height, sigmaPx);
    setSpectrumExecutor(null);
    expect(kernels).toEqual(["box-rows", "box-columns", "box-rows", "box-columns", "box-rows", "box-columns"]);
    expect(bits(two).equals(bits(one))).toBe(true);
  });

  it("makes the tissue search's texture map bit for bit as one thread does", () => {
    // A grid of 2²⁰ cells and more is split (a 2048² frame binned by 2); odd sizes, so the rows of cells do not halve evenly.
    const width = 1030,
      height = 1022;
    const rng = createRng(12);
    const shared = () => new Float32Array(new SharedArrayBuffer(4 * width * height));
    const residual = shared(),
      intensity = shared();
    for (let i = 0; i < residual.length; i++) {
      const x = i % width;
      residual[i] = (x < width / 2 ? Math.sin(x / 3) : 0) + 0.3 * rng.normal();
      intensity[i] = 1 + 0.1 * rng.normal();
    }
    setSpectrumExecutor(null);
    const one = computeTextureMap(residual, intensity, width, height, null)!;
    const kernels: RowKernel[] = [];
    setSpectrumExecutor(counting(kernels));
    const two = computeTextureMap(residual, intensity, width, height, null)!;
    setSpectrumExecutor(null);
    expect(kernels).toContain("texture-rows");
    expect(kernels).toContain("blur-grids");
    for (const key of ["logSnr", "brightness", "sd"] as const) expect(bits(two[key]).equals(bits(one[key]))).toBe(true);
    expect(Buffer.from(two.use).equals(Buffer.from(one.use))).toBe(true);
    // The textured half and the flat half differ (the map is not trivially equal).
    expect(one.logSnr[10 * one.columns + 5]).toBeGreaterThan(one.logSnr[10 * one.columns + one.columns - 5] + 2);
  });

  it("reads a tissue frame with the same numbers as one thread (the default readout)", () => {
    const { image } = makeTissueFrame({
      width: 1100,
      height: 1030,
      pattern: "spots",
      wavelengthPx: 24,
      vignetting: 3,
      gradient: 2,
      noise: 0.3,
      seed: 5,
      tissue: { shape: "ellipse", coverage: 0.5, slide: "dark" },
    });
    const data = new Float32Array(new SharedArrayBuffer(4 * image.data.length));
    data.set(image.data);
    const frame = { ...image, data };
    setSpectrumExecutor(null);
    const one = readWavelength(frame, { pixelSizeUm: 1 });
    const kernels: RowKernel[] = [];
    setSpectrumExecutor(counting(kernels));
    const two = readWavelength(frame, { pixelSizeUm: 1 });
    setSpectrumExecutor(null);
    expect(kernels).toContain("residual-rows");
    expect(kernels).toContain("radial-rows");
    expect(one.periodFound).toBe(true);
    expect(two).toEqual(one);
    expect(Object.is(two.wavelengthUm, one.wavelengthUm)).toBe(true);
  });
});
