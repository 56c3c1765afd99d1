/** Between-specimen spread added in quadrature (hand-computed values; common practice, no source). */
import { describe, expect, it } from "vitest";
import { addReplicateSpread } from "@/lib/fitting";

describe("addReplicateSpread", () => {
  it("adds each condition's sample SD in quadrature and leaves single data alone", () => {
    const { data, spreads } = addReplicateSpread([
      { condition: "control", wavelengthUm: 10, uncertaintyUm: 0.1, kind: "fourier" },
      { condition: "control", wavelengthUm: 12, uncertaintyUm: 0.2, kind: "fourier" },
      { condition: "treated", wavelengthUm: 15, uncertaintyUm: 0.3, kind: "fourier" },
    ]);
    // SD of {10, 12} with n − 1: √2 = 1.414213562; √(0.1² + 2) = 1.417744688; √(0.2² + 2) = 1.428285686.
    expect(data[0].uncertaintyUm).toBeCloseTo(1.417744688, 8);
    expect(data[1].uncertaintyUm).toBeCloseTo(1.428285686, 8);
    expect(data[2].uncertaintyUm).toBe(0.3);
    expect(data.map((d) => d.wavelengthUm)).toEqual([10, 12, 15]);
    expect(spreads).toEqual([
      { condition: "control", kind: "fourier", n: 2, sdUm: Math.SQRT2 },
      { condition: "treated", kind: "fourier", n: 1, sdUm: 0 },
    ]);
  });

  it("keeps kinds apart within a condition", () => {
    const { spreads } = addReplicateSpread([
      { condition: "c", wavelengthUm: 10, uncertaintyUm: 1, kind: "fourier" },
      { condition: "c", wavelengthUm: 20, uncertaintyUm: 1, kind: "nearest-neighbour" },
    ]);
    expect(spreads.map((s) => s.n)).toEqual([1, 1]);
  });
});
