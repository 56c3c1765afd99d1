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
import { prepareWholeFrame } from "@/lib/readout/prepare-whole-frame";
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
  let splits = 0;
  const counting: SpectrumExecutor = {
    halfPower: (job) => threads.halfPower(job),
    splitRows: (...args) => (splits++, threads.splitRows(...args)),
  };
  setSpectrumExecutor(counting);
  const two = prepareWholeFrame(image, settings);
  setSpectrumExecutor(null);
  return { one, two, splits };
}

const bits = (a: Float32Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength);

describe("the whole-frame residual pass on two threads", () => {
  const plain = sharedFrame();
  const onSlide = sharedFrame({ tissue: { shape: "ellipse", coverage: 0.5, slide: "dark" } });
  for (const flatten of ["auto", "plane", "blur"] as const)
    for (const [what, image] of [
      ["pattern filling the frame", plain],
      ["tissue on a dark slide", onSlide],
    ] as const)
      it(`gives one thread's numbers bit for bit, flatten "${flatten}", ${what}`, () => {
        const { one, two, splits } = oneAndTwo(image, { flatten });
        expect(splits).toBe(1);
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
    const { one, two, splits } = oneAndTwo(debris, {});
    expect(splits).toBe(1);
    expect(one).toBeNull();
    expect(two).toBeNull();
  });

  // What the readout child installs with --threads 2 (the server's default): both parts split.
  it("splits the pass with the executor a readout process installs (its thread started on demand)", () => {
    const settings = resolveReadoutOptions({ pixelSizeUm: 1, flatten: "plane" }, plain.width, plain.height);
    setSpectrumExecutor(null);
    const one = prepareWholeFrame(plain, settings)!;
    const onDemand = startSpectrumThreadsOnDemand();
    let splits = 0;
    setSpectrumExecutor({
      halfPower: onDemand.halfPower,
      splitRows: (...args) => (splits++, onDemand.splitRows!(...args)),
    });
    const two = prepareWholeFrame(plain, settings)!;
    setSpectrumExecutor(null);
    expect(splits).toBe(1);
    expect(bits(two.data).equals(bits(one.data))).toBe(true);
  });
});
