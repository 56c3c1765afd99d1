import { fft as refFft } from "fft-js";
import { describe, expect, it } from "vitest";
import { fft2dInPlace, halfPowerSpectrum, inverseRealFft2d, nextPowerOfTwo, realFft2d } from "@/lib/fft";
import { createRng } from "@/lib/synthetic";

/** 2-D DFT by the row–column method using fft-js (a separate reference implementation). */
function reference2d(img: Float64Array, w: number, h: number): [number, number][][] {
  const rows: [number, number][][] = [];
  for (let y = 0; y < h; y++) rows.push(refFft(Array.from(img.subarray(y * w, (y + 1) * w))));
  const out: [number, number][][] = Array.from({ length: h }, () => new Array<[number, number]>(w));
  for (let x = 0; x < w; x++) {
    const col = refFft(rows.map((r) => r[x]));
    for (let y = 0; y < h; y++) out[y][x] = col[y];
  }
  return out;
}

function randomImage(w: number, h: number, seed: number): Float64Array {
  const rng = createRng(seed);
  return Float64Array.from({ length: w * h }, () => rng.normal());
}

describe.each([
  [8, 8],
  [16, 4],
  [4, 32],
])("2-D FFT %i×%i", (w, h) => {
  const img = randomImage(w, h, w * 100 + h);
  const ref = reference2d(img, w, h);

  it("complex fft2dInPlace matches fft-js to 1e-9", () => {
    const c = new Float64Array(2 * w * h);
    img.forEach((v, i) => (c[2 * i] = v));
    fft2dInPlace(c, w, h);
    for (let y = 0; y < h; y++)
      for (let x = 0; x < w; x++) {
        expect(c[2 * (y * w + x)]).toBeCloseTo(ref[y][x][0], 9);
        expect(c[2 * (y * w + x) + 1]).toBeCloseTo(ref[y][x][1], 9);
      }
  });

  it("realFft2d half spectrum matches fft-js columns 0…W/2", () => {
    const s = realFft2d(img, w, h, w, h);
    for (let y = 0; y < h; y++)
      for (let x = 0; x <= w / 2; x++) {
        expect(s.data[2 * (y * s.halfWidth + x)]).toBeCloseTo(ref[y][x][0], 9);
        expect(s.data[2 * (y * s.halfWidth + x) + 1]).toBeCloseTo(ref[y][x][1], 9);
      }
  });

  it("Parseval: Σ|x|² = (1/WH)·Σ|X|² over the full plane (Parseval's theorem for the DFT)", () => {
    const s = realFft2d(img, w, h, w, h);
    const p = halfPowerSpectrum(s);
    let energy = 0;
    for (const v of img) energy += v * v;
    let total = 0;
    for (let y = 0; y < h; y++)
      for (let x = 0; x < s.halfWidth; x++) {
        // columns 1 … W/2−1 stand for themselves and their Hermitian mirror
        total += (x === 0 || x === w / 2 ? 1 : 2) * p[y * s.halfWidth + x];
      }
    expect(total / (w * h)).toBeCloseTo(energy, 3);
  });

  it("round trips: inverse(forward(x)) = x, complex and real (invertibility of the DFT)", () => {
    const c = new Float64Array(2 * w * h);
    img.forEach((v, i) => (c[2 * i] = v));
    fft2dInPlace(c, w, h);
    fft2dInPlace(c, w, h, true);
    const back = inverseRealFft2d(realFft2d(img, w, h, w, h));
    for (let i = 0; i < w * h; i++) {
      expect(c[2 * i]).toBeCloseTo(img[i], 10);
      expect(c[2 * i + 1]).toBeCloseTo(0, 10);
      expect(back[i]).toBeCloseTo(img[i], 10);
    }
  });
});

describe("zero padding and sizes", () => {
  it("padding a 5×3 image into 8×4 equals transforming the explicitly padded image (definition of the DFT)", () => {
    const small = randomImage(5, 3, 7);
    const padded = new Float64Array(32);
    for (let y = 0; y < 3; y++) for (let x = 0; x < 5; x++) padded[y * 8 + x] = small[y * 5 + x];
    const a = realFft2d(small, 5, 3, 8, 4);
    const b = realFft2d(padded, 8, 4, 8, 4);
    a.data.forEach((v, i) => expect(v).toBeCloseTo(b.data[i], 12));
  });
  it.each([
    [1, 2],
    [2, 2],
    [3, 4],
    [512, 512],
    [513, 1024],
  ])("nextPowerOfTwo(%i) = %i (definition)", (n, p) => {
    expect(nextPowerOfTwo(n)).toBe(p);
  });
});
