import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { DctPlan } from "@/lib/fft";

function randomArray(n: number, seed: string): Float64Array {
  const rng = seedrandom(seed);
  return Float64Array.from({ length: n }, () => 2 * rng() - 1);
}

/** Columns col and col + 1 of a row-major block (rows × stride) as two contiguous rows. */
function columns(block: Float64Array, rows: number, stride: number, col: number): Float64Array {
  const out = new Float64Array(2 * rows);
  for (let r = 0; r < rows; r++) {
    out[r] = block[r * stride + col];
    out[rows + r] = block[r * stride + col + 1];
  }
  return out;
}

describe("DctPlan column pairs (the 2-D basis' second pass, read without a transpose)", () => {
  it.each([4, 8, 64, 256])("forwardColumnPair equals forwardRows of the two columns, bit for bit (N = %i)", (N) => {
    const stride = 7,
      col = 3;
    const block = randomArray(N * stride, `cols-f-${N}`);
    const plan = new DctPlan(N);
    const got = new Float64Array(2 * N);
    plan.forwardColumnPair(block, stride, col, got, 0, N);
    const want = new Float64Array(2 * N);
    plan.forwardRows(columns(block, N, stride, col), want, 2);
    expect(Array.from(got)).toEqual(Array.from(want));
  });

  it.each([4, 8, 64, 256])("inverseColumnPair equals inverseRows of the two columns, bit for bit (N = %i)", (N) => {
    const stride = 5,
      col = 2;
    const block = randomArray(N * stride, `cols-i-${N}`);
    const plan = new DctPlan(N);
    const got = new Float64Array(2 * N);
    plan.inverseColumnPair(block, stride, col, got, 0, N);
    const want = new Float64Array(2 * N);
    plan.inverseRows(columns(block, N, stride, col), want, 2);
    expect(Array.from(got)).toEqual(Array.from(want));
  });

  it("writes the two output rows at any offsets and leaves the rest of dst alone", () => {
    const N = 16,
      stride = 4;
    const block = randomArray(N * stride, "cols-offsets");
    const plan = new DctPlan(N);
    const dst = new Float64Array(4 * N).fill(7);
    plan.forwardColumnPair(block, stride, 0, dst, 3 * N, N);
    const want = new Float64Array(2 * N);
    plan.forwardRows(columns(block, N, stride, 0), want, 2);
    expect(Array.from(dst.subarray(3 * N))).toEqual(Array.from(want.subarray(0, N)));
    expect(Array.from(dst.subarray(N, 2 * N))).toEqual(Array.from(want.subarray(N)));
    expect(Array.from(dst.subarray(0, N)).every((v) => v === 7)).toBe(true);
    expect(Array.from(dst.subarray(2 * N, 3 * N)).every((v) => v === 7)).toBe(true);
  });
});
