import { describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeDispersion, describeRepeats, enumerateModes } from "@/lib/stability";

describe("admissible modes (SCIENCE.md §2)", () => {
  it("interval of length 10: k_n = nπ/10 (hand-computed: 0.3142, 0.6283, 0.9425)", () => {
    const modes = enumerateModes({ kind: "interval", length: 10 }, 1);
    expect(modes.map((m) => m.indices[0])).toEqual([1, 2, 3]);
    [0.314159, 0.628319, 0.942478].forEach((k, i) => expect(modes[i].k).toBeCloseTo(k, 6));
  });

  it("sphere of radius 2: k² = l(l+1)/R² and multiplicity 2l + 1 (hand-computed l = 1..3: k = 0.7071, 1.2247, 1.7321)", () => {
    const modes = enumerateModes({ kind: "sphere", radius: 2 }, 1.8);
    expect(modes.map((m) => [m.indices[0], m.multiplicity])).toEqual([
      [1, 3],
      [2, 5],
      [3, 7],
    ]);
    [0.707107, 1.224745, 1.732051].forEach((k, i) => expect(modes[i].k).toBeCloseTo(k, 6));
  });

  it("rectangle 2 × 1: k² = (mπ/2)² + (nπ)² (geometry), (0, 0) excluded", () => {
    const modes = enumerateModes({ kind: "rectangle", lx: 2, ly: 1 }, 3.6);
    const ids = modes.map((m) => m.indices.join(","));
    expect(ids).toEqual(["0,1", "1,0", "1,1", "2,0"]); // (2, 1): k = π√2 ≈ 4.44 > 3.6; (3, 0): 3π/2 ≈ 4.71
    expect(modes.find((m) => m.indices.join() === "1,1")!.k).toBeCloseTo(Math.PI * Math.sqrt(1.25), 12);
  });

  it("repeats: interval mode n = 5 lays 2.5 wavelengths and 3 maxima counting the boundary (SCIENCE.md §2)", () => {
    const d = { kind: "interval" as const, length: 1 };
    expect(describeRepeats(d, { indices: [5], k: 5 * Math.PI, multiplicity: 1 })).toEqual({
      wavelengthsAcross: 2.5,
      maxima: 3,
    });
    expect(describeRepeats(d, { indices: [4], k: 4 * Math.PI, multiplicity: 1 })).toEqual({
      wavelengthsAcross: 2,
      maxima: 3,
    });
  });

  it("the fastest admissible mode on an interval is the n maximising σ(nπ/L) (brute force over n)", () => {
    const k = getCatalogueKinetics("schnakenberg");
    const L = 40;
    const r = computeDispersion(k, {}, { domain: { kind: "interval", length: L } });
    const brute = [...Array(30).keys()]
      .map((i) => i + 1)
      .map((n) => ({
        n,
        s: computeDispersion(k, {}, { kMax: (n * Math.PI) / L, gridSize: 16 }).curve.sigma.at(-1)!,
      }));
    const best = brute.reduce((a, b) => (b.s > a.s ? b : a));
    expect(r.domain!.fastestMode.indices).toEqual([best.n]);
    expect(r.domain!.fastestMode.sigma).toBeCloseTo(best.s, 12);
    // λ* ≈ 12.9 model units (the unbounded result) → about 40/12.9 ≈ 3.1 wavelengths, so n ≈ 6
    expect(Math.abs(best.n - (2 * L) / r.fastest!.wavelength)).toBeLessThan(1);
    expect(r.domain!.patterningExpected).toBe(true);
  });

  it("a domain shorter than half a wavelength holds no growing mode", () => {
    const r = computeDispersion(getCatalogueKinetics("schnakenberg"), {}, { domain: { kind: "interval", length: 2 } });
    expect(r.domain!.patterningExpected).toBe(false);
    expect(r.domain!.unstableModeCount).toBe(0);
    expect(r.domain!.fastestMode.indices).toEqual([1]);
  });
});
