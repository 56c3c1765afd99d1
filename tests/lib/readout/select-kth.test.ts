/**
 * selectKth must give exactly the value a sort puts at index k (the outlier limits are order
 * statistics of a sample, taken by selection instead of a sort): checked against
 * Float32Array.prototype.sort on random arrays with many ties, sorted and reversed input, and a
 * NaN (the reference is the sort itself; common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { outlierLimits, selectKth } from "@/lib/readout/outliers";
import { createRng } from "@/lib/synthetic/random";

describe("selectKth", () => {
  it("gives the sorted array's k-th value for every k", () => {
    const rng = createRng(7).uniform;
    for (const n of [1, 2, 3, 5, 16, 101, 1000]) {
      for (const kind of ["random", "ties", "sorted", "reversed"] as const) {
        const base = Float32Array.from({ length: n }, (_, i) =>
          kind === "random" ? rng() - 0.5 : kind === "ties" ? Math.floor(rng() * 4) : kind === "sorted" ? i : n - i,
        );
        const sorted = base.slice().sort();
        for (let k = 0; k < n; k += Math.max(1, Math.floor(n / 37))) expect(selectKth(base.slice(), k)).toBe(sorted[k]);
      }
    }
  });
  it("falls back to the sort's order with a NaN", () => {
    const a = Float32Array.from([3, NaN, 1, 2]);
    expect(selectKth(a.slice(), 0)).toBe(1);
    expect(selectKth(a.slice(), 3)).toBeNaN();
  });
  it("gives the outlier limits of the sorted sample from any order", () => {
    const rng = createRng(3).uniform;
    const s = Float32Array.from({ length: 5000 }, () => (rng() - 0.5) * (rng() < 0.01 ? 40 : 1));
    const fromSorted = outlierLimits(s.slice().sort());
    expect(outlierLimits(s.slice().reverse())).toEqual(fromSorted);
    expect(fromSorted).not.toBeNull();
  });
});
