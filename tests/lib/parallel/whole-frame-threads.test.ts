/**
 * The whole-frame residual pass split between two threads (SpectrumExecutor.splitRows) must give
 * exactly what one thread gives: the same flattened pixels to the last bit, the same tissue mask
 * and counts, and the same "step aside" (null) on a frame with debris. Each row is computed by the
 * same function on either thread and the sums across rows are added in row order, so bit-identity
 * is the check (the requirement "identical numbers on one and two threads"; common practice, no source).
 */
import { afterAll, describe, expect, it } from "vitest";
import { setSpectrumExecutor, type SpectrumExecutor } from "@/lib/fft";
import type { GreyImage } from "@/lib/imaging";
import { createSpectrumThreads, startSpectrumThreadsOnDemand } from "@/lib/parallel/spectrum-threads";
import { resolveReadoutOptions, type ReadoutOptions } from "@/lib/readout";
import { emptyCoarseSums } from "@/lib/readout/coarse-background";
import { prepareWholeFrame } from "@/lib/readout/prepare-whole-frame";
import { takeRegionStats } from "@/lib/readout/region-stats";
import { makeTissueFrame, type TissueFrameOptions } from "@/lib/synthetic";

const threads = createSpectrumThreads();
afterAll(() => {
  setSpectrumExecutor(null);
  threads.dispose();
});

/** A frame above 2²⁰ px (the size from which work is split), its pixels in shared memory as the TIFF reader leaves them. */
function sharedFrame(extra: Partial<TissueFrameOptions> = {}): GreyImage {
  const { image } = makeTissueFrame({
    width: 1100,
    height: 1030,
    pattern: "spots",
    wavelengthPx: 24,
    vignetting: 3,
    gradient: 2,
    noise: 0.3,
    seed: 5,
    ...extra,
  });
  const data = new Float32Array(new SharedArrayBuffer(4 * image.data.length));
  data.set(image.data);
  return { ...image, data };
}

/** prepareWholeFrame on one thread, then on two (counting the split passes). */
function oneAndTwo(image: GreyImage, options: ReadoutOptions) {
  const settings = resolveReadoutOptions({ pixelSizeUm: 1, ...options }, image.width, image.height);
  setSpectrumExecutor(null);
  const one = prepareWholeFrame(image, settings);
  const kernels: string[] = [];
  const counting: SpectrumExecutor = {
    halfPower: (job) => threads.halfPower(job),
    splitRows: (...args) => (kernels.push(args[0]), threads.splitRows(...args)),
  };
  setSpectrumExecutor(counting);
  const two = prepareWholeFrame(image, settings);
  setSpectrumExecutor(null);
  return { one, two, kernels };
}

const bits = (a: Float32Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength);

describe("the whole-frame passes on two threads", () => {
  const plain = sharedFrame();
  const onSlide = sharedFrame({ tissue: { shape: "ellipse", coverage: 0.5, slide: "dark" } });
  for (const flatten of ["auto", "plane", "blur"] as const)
    for (const [what, image] of [
      ["pattern filling the frame", plain],
      ["tissue on a dark slide", onSlide],
    ] as const)
      it(`gives one thread's numbers bit for bit, flatten "${flatten}", ${what}`, () => {
        const { one, two, kernels } = oneAndTwo(image, { flatten });
        expect(kernels).toEqual(["region-stats", "residual-rows"]);
        expect(one).not.toBeNull();
        const { data: a, included: ia, tissueMask: ma, ...restA } = one!;
        const { data: b, included: ib, tissueMask: mb, ...restB } = two!;
        expect(restB).toEqual(restA);
        expect(bits(b).equals(bits(a))).toBe(true);
        expect(ib === null).toBe(ia === null);
        expect(mb === null).toBe(ma === null);
        if (ma && mb) expect(Buffer.from(mb).equals(Buffer.from(ma))).toBe(true);
        if (what === "tissue on a dark slide") expect(ma).not.toBeNull();
      });

  // A lone bright pixel (not clipped: a single maximum) is debris to treat, so the step-by-step path must run;
  // in the worker's rows (below the middle) or the caller's.
  it.each([
    ["the second thread's rows", 900],
    ["the calling thread's rows", 100],
  ])("steps aside on two threads where one does: debris in %s", (_, row) => {
    const debris = sharedFrame();
    debris.data[row * debris.width + 500] += 5;
    const { one, two, kernels } = oneAndTwo(debris, {});
    expect(kernels).toEqual(["region-stats", "residual-rows"]);
    expect(one).toBeNull();
    expect(two).toBeNull();
  });

  // What the readout child installs with --threads 2 (the server's default): both parts split.
  it("splits the pass with the executor a readout process installs (its thread started on demand)", () => {
    const settings = resolveReadoutOptions({ pixelSizeUm: 1, flatten: "plane" }, plain.width, plain.height);
    setSpectrumExecutor(null);
    const one = prepareWholeFrame(plain, settings)!;
    const onDemand = startSpectrumThreadsOnDemand();
    const kernels: string[] = [];
    setSpectrumExecutor({
      halfPower: onDemand.halfPower,
      splitRows: (...args) => (kernels.push(args[0]), onDemand.splitRows!(...args)),
    });
    const two = prepareWholeFrame(plain, settings)!;
    setSpectrumExecutor(null);
    expect(kernels).toEqual(["region-stats", "residual-rows"]);
    expect(bits(two.data).equals(bits(one.data))).toBe(true);
  });
});

describe("the region's statistics on two threads", () => {
  // Ties at both extremes in both halves: the counts of equal extremes must add up as one pass counts them.
  it("gives one thread's extremes, counts, sums and grid sums bit for bit", () => {
    const width = 1100,
      height = 1030;
    const src = new Float32Array(new SharedArrayBuffer(4 * width * height));
    for (let i = 0; i < src.length; i++) src[i] = Math.fround(0.5 + 0.3 * Math.sin(i * 0.37) * Math.cos(i * 0.0011));
    for (const at of [10, 20, 900 * width + 3, 1000 * width + 7]) {
      src[at] = 0.9;
      src[at + 1] = 0.1;
    }
    const take = () => {
      const grid = emptyCoarseSums(width, height, 64);
      return { stats: takeRegionStats(src, width, height, grid), grid };
    };
    setSpectrumExecutor(null);
    const one = take();
    const kernels: string[] = [];
    setSpectrumExecutor({
      halfPower: threads.halfPower,
      splitRows: (...args) => (kernels.push(args[0]), threads.splitRows(...args)),
    });
    const two = take();
    setSpectrumExecutor(null);
    expect(kernels).toEqual(["region-stats"]);
    expect(one.stats).toMatchObject({ min: Math.fround(0.1), max: Math.fround(0.9), atMin: 4, atMax: 4 });
    expect(two.stats).toEqual(one.stats);
    expect(bits(two.grid.sum).equals(bits(one.grid.sum))).toBe(true);
    expect(bits(two.grid.count).equals(bits(one.grid.count))).toBe(true);
  });
});
