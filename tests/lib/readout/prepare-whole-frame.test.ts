/**
 * The whole-frame fast path of the readout's preparation (three passes over the pixels) must give
 * exactly the numbers of the step-by-step path: the same flattened pixels to the last bit, the same
 * tissue mask and the same counts, for every flattening, with and without a tissue on a slide; and
 * it must step aside (null) where the step-by-step path has work it does not do (clipped pixels,
 * debris, a ROI, inversion, a small frame). Bit-identity is the check because the fast path only
 * reorders passes, not sums (common practice, no source). Frames above 1024 px, so the tissue is
 * searched on a binned grid as on a microscope frame.
 */
import { describe, expect, it } from "vitest";
import { resolveReadoutOptions, type ReadoutOptions } from "@/lib/readout";
import { prepareRegionStepByStep } from "@/lib/readout/prepare-region";
import { prepareWholeFrame } from "@/lib/readout/prepare-whole-frame";
import { makeTissueFrame, type TissueFrameOptions } from "@/lib/synthetic";

const W = 1100,
  H = 1030; // not multiples of the binning, so partial blocks at the edges are dropped as binPixels drops them

function frame(extra: Partial<TissueFrameOptions> = {}) {
  return makeTissueFrame({
    width: W,
    height: H,
    pattern: "spots",
    wavelengthPx: 24,
    vignetting: 3,
    gradient: 2,
    noise: 0.3,
    seed: 5,
    ...extra,
  }).image;
}

function both(image: ReturnType<typeof frame>, options: ReadoutOptions) {
  const settings = resolveReadoutOptions({ pixelSizeUm: 1, ...options }, image.width, image.height);
  const fast = prepareWholeFrame(image, settings);
  const slow = prepareRegionStepByStep(image, settings);
  return { fast, slow };
}

function expectSame(
  fast: ReturnType<typeof prepareWholeFrame>,
  slow: ReturnType<typeof prepareRegionStepByStep>,
): void {
  expect(fast).not.toBeNull();
  const { data: a, included: ia, tissueMask: ma, ...restA } = fast!;
  const { data: b, included: ib, tissueMask: mb, ...restB } = slow;
  expect(restA).toEqual(restB);
  expect(
    Buffer.from(a.buffer, a.byteOffset, a.byteLength).equals(Buffer.from(b.buffer, b.byteOffset, b.byteLength)),
  ).toBe(true);
  expect(ia === null).toBe(ib === null);
  if (ia && ib) expect(Buffer.from(ia).equals(Buffer.from(ib))).toBe(true);
  expect(ma === null).toBe(mb === null);
  if (ma && mb) expect(Buffer.from(ma).equals(Buffer.from(mb))).toBe(true);
}

describe("prepareWholeFrame", () => {
  const plain = frame();
  const onSlide = frame({ tissue: { shape: "ellipse", coverage: 0.5, slide: "dark" } });
  for (const flatten of ["auto", "plane", "blur", "none"] as const) {
    it(`gives the step-by-step numbers bit for bit, flatten "${flatten}", pattern filling the frame`, () => {
      const { fast, slow } = both(plain, { flatten });
      expectSame(fast, slow);
      expect(slow.tissueMask).toBeNull();
    });
    it(`gives the step-by-step numbers bit for bit, flatten "${flatten}", tissue on a dark slide`, () => {
      const { fast, slow } = both(onSlide, { flatten });
      expectSame(fast, slow);
      expect(slow.tissueMask).not.toBeNull();
    });
  }
  it.each([
    [3, 2100],
    [4, 3100],
  ])("gives the same numbers when the tissue search bins by %i (a frame %i px wide)", (_, width) => {
    const wide = frame({ width, height: 1030, tissue: { shape: "ellipse", coverage: 0.5, slide: "dark" } });
    for (const flatten of ["auto", "plane"] as const) {
      const { fast, slow } = both(wide, { flatten });
      expectSame(fast, slow);
      expect(slow.tissueMask).not.toBeNull();
    }
  });
  it.each([3100, 3102])(
    "gives the same numbers on a frame %i px wide filled by the pattern (binning by 4: rows of blocks in one loop, or not)",
    (width) => {
      const wide = frame({ width, height: 1030 });
      for (const flatten of ["auto", "plane"] as const) {
        const { fast, slow } = both(wide, { flatten });
        expectSame(fast, slow);
        expect(slow.tissueMask).toBeNull();
      }
    },
  );
  it("gives the same numbers with the tissue search or the outlier treatment off", () => {
    for (const o of [{ tissueMask: "off" }, { outliers: "off" }, { outliers: "off", flatten: "plane" }] as const) {
      const { fast, slow } = both(onSlide, o);
      expectSame(fast, slow);
    }
  });
  it("steps aside where the step-by-step path has more to do", () => {
    const settings = (image: ReturnType<typeof frame>, o: ReadoutOptions = {}) =>
      resolveReadoutOptions({ pixelSizeUm: 1, ...o }, image.width, image.height);
    const debris = frame({ debrisCount: 20, seed: 6 });
    expect(prepareWholeFrame(debris, settings(debris))).toBeNull();
    expect(prepareWholeFrame(plain, settings(plain, { invert: true }))).toBeNull();
    expect(
      prepareWholeFrame(plain, settings(plain, { roi: { kind: "rect", x: 10, y: 10, width: 1050, height: 1000 } })),
    ).toBeNull();
    expect(
      prepareWholeFrame(plain, settings(plain, { tissueMask: "off", outliers: "off", flatten: "plane" })),
    ).toBeNull();
    const small = frame({ width: 512, height: 512 });
    expect(prepareWholeFrame(small, settings(small))).toBeNull();
  });
});
