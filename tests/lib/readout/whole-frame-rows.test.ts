/**
 * The one-loop rows of the whole-frame pass must give the numbers of the three loops they replace
 * (residualRow, planeRow, addBlockSums), bit for bit: they only fuse the loops, with every sum in
 * the same order (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import {
  addBlockSums,
  autoResidualRow4,
  planeResidualRow4,
  planeRow,
  residualRow,
} from "@/lib/readout/whole-frame-rows";

const W = 64,
  blocks = W / 4;

/** A deterministic row of stored values (0…1) and two background rows, with a few extremes. */
function inputs(seed: number) {
  let s = seed;
  const next = () => (s = (s * 1103515245 + 12345) % 2147483648) / 2147483648;
  const src = Float32Array.from({ length: 3 * W }, next);
  src[W + 7] = 1e3; // a bright outlier
  src[W + 40] = -1e3;
  const bg = Float32Array.from({ length: 2 * W }, () => 0.4 + 0.2 * next());
  return { src, bg };
}

const bits = (a: Float32Array | Float64Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength);

describe("planeResidualRow4", () => {
  it("equals residualRow, planeRow and addBlockSums on the same row", () => {
    for (const seed of [1, 2, 3]) {
      const { src, bg } = inputs(seed);
      const row = W; // the second row of src
      const [uy, ty, offset, base, c1] = [0.3, 0.7, 0.05, 0.12, -1e-3];
      const res = new Float32Array(W),
        extremes = new Float64Array(3),
        sums = new Float64Array(2);
      const dataA = new Float32Array(3 * W),
        accRA = new Float64Array(blocks).fill(0.25),
        accIA = new Float64Array(blocks).fill(-0.5);
      residualRow(src, row, bg, 0, W, uy, ty, offset, res, 0, W, extremes);
      planeRow(src, row, dataA, base, c1, W, sums);
      addBlockSums(res, 0, src, row, accRA, accIA, blocks, 4);
      const dataB = new Float32Array(3 * W),
        accRB = new Float64Array(blocks).fill(0.25),
        accIB = new Float64Array(blocks).fill(-0.5),
        extremesB = new Float64Array(3),
        sumsB = new Float64Array(2);
      planeResidualRow4(src, row, bg, 0, W, uy, ty, offset, dataB, base, c1, accRB, accIB, blocks, extremesB, sumsB);
      expect(bits(dataB).equals(bits(dataA))).toBe(true);
      expect(bits(accRB).equals(bits(accRA))).toBe(true);
      expect(bits(accIB).equals(bits(accIA))).toBe(true);
      expect([extremesB[0], extremesB[1]]).toEqual([extremes[0], extremes[1]]);
      expect(extremes[0]).toBeGreaterThan(900); // the outliers are the extremes
      expect(bits(sumsB).equals(bits(sums))).toBe(true);
    }
  });
});

describe("autoResidualRow4", () => {
  it("equals the row less the plane, residualRow and addBlockSums on the same row", () => {
    for (const seed of [4, 5, 6]) {
      const { src, bg } = inputs(seed);
      const row = W;
      const [uy, ty, offset, sbase, sc1] = [0.6, 0.4, -0.02, 0.2, 2e-3];
      const line = new Float32Array(W);
      for (let x = 0; x < W; x++) line[x] = src[row + x] - (sbase + sc1 * x);
      const dataA = new Float32Array(3 * W),
        extremes = new Float64Array(3),
        accRA = new Float64Array(blocks).fill(1),
        accIA = new Float64Array(blocks).fill(2);
      residualRow(line, 0, bg, 0, W, uy, ty, offset, dataA, row, W, extremes);
      addBlockSums(dataA, row, line, 0, accRA, accIA, blocks, 4);
      const dataB = new Float32Array(3 * W),
        extremesB = new Float64Array(3),
        accRB = new Float64Array(blocks).fill(1),
        accIB = new Float64Array(blocks).fill(2);
      autoResidualRow4(src, row, sbase, sc1, bg, 0, W, uy, ty, offset, dataB, accRB, accIB, blocks, extremesB);
      expect(bits(dataB).equals(bits(dataA))).toBe(true);
      expect(bits(extremesB).equals(bits(extremes))).toBe(true);
      expect(bits(accRB).equals(bits(accRA))).toBe(true);
      expect(bits(accIB).equals(bits(accIA))).toBe(true);
    }
  });
});
