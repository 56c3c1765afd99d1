import { afterAll, describe, expect, it } from "vitest";
import { realPowerSpectrum2d, setSpectrumExecutor } from "@/lib/fft";
import { createSpectrumThreads } from "@/lib/parallel/spectrum-threads";
import { makeWindow1d } from "@/lib/readout/window";
import { createRng } from "@/lib/synthetic";

const threads = createSpectrumThreads();
afterAll(() => {
  setSpectrumExecutor(null);
  threads.dispose();
});

/** Number of bins whose bits differ. */
const differing = (a: Float32Array, b: Float32Array) => a.reduce((n, x, i) => n + (Object.is(x, b[i]) ? 0 : 1), 0);

describe("the readout's 2-D FFT on two threads", () => {
  // Each row and column is the same transform on either thread, so the bits must agree exactly
  // (the requirement "identical numbers on one and two threads"; common practice, no source).
  it.each([
    ["1024 × 1024, float32", 1024, 1024, "float32"],
    ["1000 × 1030 padded to 1024 × 2048, odd rows per thread, float64", 1000, 1030, "float64"],
    // After the first case: its reused half spectrum still holds that transform in the zero-padding rows, which must read as zeros.
    ["1024 × 1000 padded to 1024 × 1024, after a 1024 × 1024 image, float32", 1024, 1000, "float32"],
  ] as const)("gives the same |F|² as one thread, bit for bit: %s", (_, w, h, precision) => {
    const rng = createRng(w + h);
    const img = Float32Array.from({ length: w * h }, () => rng.normal());
    const opts = { windowX: makeWindow1d("hann", w), windowY: makeWindow1d("hann", h), precision };
    const W = 1024,
      H = h > 1024 ? 2048 : 1024;
    setSpectrumExecutor(null);
    const one = realPowerSpectrum2d(img, w, h, W, H, opts);
    let used = 0;
    setSpectrumExecutor({ halfPower: (job) => (used++, threads.halfPower(job)) });
    const two = realPowerSpectrum2d(img, w, h, W, H, opts);
    setSpectrumExecutor(null);
    expect(used).toBe(1);
    expect(two.power.length).toBe(one.power.length);
    expect(differing(two.power, one.power)).toBe(0);
  });

  // An image already in shared memory (readWavelength's reused region) is read by the worker in
  // place; its |F|² may be a reused array too: the same bits, twice over the same arrays.
  it("gives the same |F|² as one thread from an image in shared memory, into a reused |F|²", () => {
    const w = 1000,
      h = 1030;
    const rng = createRng(9);
    const img = new Float32Array(new SharedArrayBuffer(4 * w * h));
    for (let i = 0; i < img.length; i++) img[i] = rng.normal();
    const opts = { windowX: makeWindow1d("hann", w), windowY: makeWindow1d("hann", h), precision: "float32" as const };
    setSpectrumExecutor(null);
    const one = realPowerSpectrum2d(img, w, h, 1024, 2048, opts);
    setSpectrumExecutor(threads);
    const first = realPowerSpectrum2d(img, w, h, 1024, 2048, { ...opts, reusePower: true });
    const firstBits = first.power.slice();
    const again = realPowerSpectrum2d(img, w, h, 1024, 2048, { ...opts, reusePower: true });
    setSpectrumExecutor(null);
    expect(again.power.buffer).toBe(first.power.buffer); // the same memory, overwritten
    expect(differing(firstBits, one.power)).toBe(0);
    expect(differing(again.power, one.power)).toBe(0);
  });
});
