/**
 * Inpainting of treated pixels (lib/readout/outliers.ts): the normalised convolution of Knutsson &
 * Westin (1993, CVPR) with blur's weights. With few treated pixels the sums are taken around each
 * of them; the reference here is the definition, num = blur(kept), den = blur(weight), computed
 * on the whole frame with `blur` (common practice, no source for the tolerance: float32 rounding
 * after each of blur's six passes, about 1e-7 relative each).
 */
import { describe, expect, it } from "vitest";
import { blur, boxBlurWeights, boxHalfWidth } from "@/lib/readout/box-blur";
import { inpaintTreated } from "@/lib/readout/outliers";

function lcg(seed: number) {
  let s = seed >>> 0;
  return () => (s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32;
}

/** The whole-frame normalised convolution, as the definition reads; `background` where no untreated pixel is near. */
function reference(data: Float32Array, width: number, height: number, treated: Uint8Array, residual: Float32Array) {
  const background = new Float32Array(data.length);
  for (let i = 0; i < data.length; i++) background[i] = data[i] - residual[i];
  const kept = new Float32Array(data.length),
    weight = new Float32Array(data.length);
  for (let i = 0; i < data.length; i++)
    if (!treated[i]) {
      kept[i] = data[i];
      weight[i] = 1;
    }
  const num = blur(kept, width, height, 2),
    den = blur(weight, width, height, 2);
  const out = data.slice(),
    outResidual = residual.slice();
  for (let i = 0; i < data.length; i++)
    if (treated[i]) {
      out[i] = den[i] > 1e-3 ? num[i] / den[i] : background[i];
      outResidual[i] = out[i] - background[i];
    }
  return { data: out, residual: outResidual, background };
}

describe("boxBlurWeights", () => {
  it("gives blur's own response to an impulse, at the ends of a line as inside it", () => {
    const len = 23,
      r = boxHalfWidth(2);
    const span = 6 * r + 1;
    const w = boxBlurWeights(len, r);
    for (const q of [0, 1, 5, 11, 20, 22]) {
      const impulse = new Float32Array(len);
      impulse[q] = 1;
      const response = blur(impulse, len, 1, 2); // one row: the column passes of a 1-pixel column are the identity
      for (let p = 0; p < len; p++) {
        const j = q - p + 3 * r;
        const expected = j >= 0 && j < span ? w[p * span + j] : 0;
        expect(response[p]).toBeCloseTo(expected, 6);
      }
    }
    // Each position's weights sum to 1 (a mean of means).
    for (let p = 0; p < len; p++) {
      let sum = 0;
      for (let j = 0; j < span; j++) sum += w[p * span + j];
      expect(sum).toBeCloseTo(1, 12);
    }
  });
});

describe("inpaintTreated", () => {
  it("gives the whole-frame normalised convolution around a few treated pixels, at edges and corners too", () => {
    const width = 157,
      height = 131,
      n = width * height;
    const rnd = lcg(7);
    const data = new Float32Array(n),
      residual = new Float32Array(n),
      treated = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      data[i] = 100 + 20 * Math.sin(i / 9) + 5 * rnd();
      residual[i] = data[i] - 100; // a flat background of 100
    }
    // Scattered pixels, small blobs, every corner and an edge run; under 1/16 of the frame.
    for (let k = 0; k < 300; k++) treated[Math.floor(rnd() * n)] = 1;
    for (const [x, y] of [
      [0, 0],
      [width - 1, 0],
      [0, height - 1],
      [width - 1, height - 1],
    ])
      treated[y * width + x] = 1;
    for (let x = 40; x < 52; x++) treated[x] = 1;
    for (let y = 60; y < 66; y++) for (let x = 80; x < 86; x++) treated[y * width + x] = 1;
    // A treated block wider than the weights reach: its centre has no untreated pixel near.
    for (let y = 100; y < 120; y++) for (let x = 20; x < 40; x++) treated[y * width + x] = 1;
    const expected = reference(data, width, height, treated, residual);
    const got = data.slice(),
      gotResidual = residual.slice();
    inpaintTreated(got, width, height, treated, gotResidual);
    let worst = 0;
    for (let i = 0; i < n; i++)
      worst = Math.max(worst, Math.abs(got[i] - expected.data[i]) / Math.abs(expected.data[i]));
    expect(worst).toBeLessThan(1e-5);
    const centre = 110 * width + 30; // nothing untreated within reach: the background
    expect(got[centre]).toBe(expected.background[centre]);
    expect(got[centre]).toBeCloseTo(100, 4);
    for (let i = 0; i < n; i++)
      if (!treated[i]) {
        expect(got[i]).toBe(data[i]);
        expect(gotResidual[i]).toBe(residual[i]);
      } else expect(gotResidual[i]).toBe(Math.fround(got[i] - expected.background[i]));
  });

  it("blurs the whole frame when many pixels are treated, as before", () => {
    const width = 64,
      height = 48,
      n = width * height;
    const rnd = lcg(3);
    const data = Float32Array.from({ length: n }, () => rnd());
    const treated = Uint8Array.from({ length: n }, () => (rnd() < 0.3 ? 1 : 0));
    const residual = data.map((v) => v - 0.5);
    const expected = reference(data, width, height, treated, residual);
    const got = data.slice(),
      gotResidual = residual.slice();
    inpaintTreated(got, width, height, treated, gotResidual);
    expect(got).toEqual(expected.data);
    expect(gotResidual).toEqual(expected.residual);
  });
});
