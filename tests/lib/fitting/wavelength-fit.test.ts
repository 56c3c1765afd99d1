import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { compareFits, fitWavelengths, HEX_SPACING_TO_FOURIER, type WavelengthDatum } from "@/lib/fitting";
import { DOSES, modelA, modelB, modelC } from "./synthetic-predictors";

const TRUE = { D: 1.5, k0: 0.02, s: 0.5 }; // invented
const lambdaA = (condition: string) => 2 * Math.PI * Math.sqrt(TRUE.D / (TRUE.k0 * (1 + TRUE.s * DOSES[condition])));
const CONDITIONS = ["control", "low", "mid", "high"];

const fourierData = (conditions = CONDITIONS): WavelengthDatum[] =>
  conditions.map((c) => ({ condition: c, wavelengthUm: lambdaA(c), uncertaintyUm: 0.5, kind: "fourier" }));

const freeK0S = {
  D: { mode: "fixed" as const, value: TRUE.D },
  k0: { mode: "free" as const, start: 0.05, lower: 1e-4, upper: 1, log: true },
  s: { mode: "free" as const, start: 0.1, lower: 0, upper: 5 },
};

describe("fitWavelengths: round trips with a closed-form predictor", () => {
  it("recovers the parameters that generated noise-free Fourier wavelengths", () => {
    const r = fitWavelengths({ data: fourierData(), parameters: freeK0S }, modelA());
    expect(r.verdict).toBe("fits");
    expect(r.convergence.converged).toBe(true);
    expect(r.parameters.map((p) => p.name)).toEqual(["k0", "s"]);
    expect(r.parameters[0].value / TRUE.k0).toBeCloseTo(1, 6);
    expect(r.parameters[1].value).toBeCloseTo(TRUE.s, 6);
    expect(r.chiSquare).toBeLessThan(1e-10);
    expect(r.identifiability.identifiable).toBe(true);
    for (const p of r.parameters) {
      expect(p.interval95!.lower.value!).toBeLessThan(p.value);
      expect(p.interval95!.upper.value!).toBeGreaterThan(p.value);
    }
    expect(r.fixed).toEqual({ D: TRUE.D });
    expect(r.turingAtFit).toEqual({ control: true, low: true, mid: true, high: true });
  });

  it("nearest-neighbour spacings a = (2/√3)·λ give the same fit, and the conversion is stated", () => {
    // Hexagonal lattice: a = (2/√3)·λ (SCIENCE.md §4, geometry).
    const spacing = fourierData().map((d) => ({
      ...d,
      wavelengthUm: d.wavelengthUm / HEX_SPACING_TO_FOURIER,
      uncertaintyUm: d.uncertaintyUm / HEX_SPACING_TO_FOURIER,
      kind: "nearest-neighbour" as const,
    }));
    const r = fitWavelengths({ data: spacing, parameters: freeK0S }, modelA());
    expect(r.parameters[1].value).toBeCloseTo(TRUE.s, 6);
    expect(r.residuals[0].measuredFourierUm).toBeCloseTo(lambdaA("control"), 10);
    expect(r.notes[0]).toMatch(
      /^Nearest-neighbour spacings \(data\[0\], data\[1\], data\[2\], data\[3\]\) were converted to Fourier wavelengths as λ = \(√3\/2\)·a/,
    );
  });

  it("a per-condition parameter is fitted separately for each condition", () => {
    const data = fourierData(["control", "high"]).flatMap((d) => [d, { ...d, wavelengthUm: d.wavelengthUm * 1.01 }]);
    const r = fitWavelengths(
      {
        data,
        parameters: {
          D: { mode: "fixed", value: TRUE.D },
          s: { mode: "fixed", value: 0 },
          k0: { mode: "per-condition", start: 0.05, lower: 1e-4, upper: 1, log: true },
        },
      },
      modelA(),
    );
    expect(r.parameters.map((p) => p.name)).toEqual(["k0[control]", "k0[high]"]);
    // With s = 0 each condition's k0 is its own rate: k = 4π²D/λ², λ the weighted mean of its two data (inverse of model A).
    for (const [j, c] of ["control", "high"].entries()) {
      const lam = lambdaA(c) * 1.005;
      expect(r.parameters[j].value / ((4 * Math.PI ** 2 * TRUE.D) / lam ** 2)).toBeCloseTo(1, 3);
    }
  });
});

describe("fitWavelengths: identifiability", () => {
  it("one measurement, two free parameters: not identifiable, with the valley D/k = (λ/2π)²", () => {
    const r = fitWavelengths(
      {
        data: [{ condition: "control", wavelengthUm: 30, uncertaintyUm: 1, kind: "fourier" }],
        parameters: {
          D: { mode: "free", start: 1, lower: 0.1, upper: 10, log: true },
          k: { mode: "free", start: 0.01, lower: 1e-3, upper: 1, log: true },
        },
      },
      modelC,
    );
    expect(r.identifiability.identifiable).toBe(false);
    expect(r.identifiability.reasons[0]).toBe(
      "1 measurement cannot determine 2 free parameters: at least 3 are needed to fit and judge the fit.",
    );
    expect(r.verdict).toBe("fits");
    const good = r.identifiability.valley!.points.filter((pt) => pt.withinConfidence);
    expect(good.length).toBeGreaterThan(5);
    // Inverse of λ = 2π√(D/k): every exact solution has D/k = (λ/2π)².
    for (const pt of good.filter((q) => q.deltaChiSquare < 1e-8))
      expect(pt.params.D / pt.params.k).toBeCloseTo((30 / (2 * Math.PI)) ** 2, 4);
  });
});

describe("fitWavelengths: the Turing region", () => {
  it("data reachable only with k above the Turing edge: 'fits only outside the Turing region'", () => {
    // Turing only for k ≤ 0.03; the data need k = 0.02·(1 + 0.5·4) = 0.06 for "high".
    const r = fitWavelengths({ data: fourierData(), parameters: freeK0S }, modelA(0.03));
    expect(r.verdict).toBe("fits only outside the Turing region");
    expect(Object.values(r.turingAtFit).every(Boolean)).toBe(true);
    expect(r.outsideTuring!.maxAbsResidual).toBeLessThan(3);
    expect(r.outsideTuring!.nonTuringConditions).toContain("high");
    expect(r.verdictReason).toMatch(/^No Turing-unstable state within the bounds reaches the measurements/);
  });

  it("a model with no prediction outside its Turing region: 'cannot reach the measured wavelength'", () => {
    const a = modelA(0.03);
    const r = fitWavelengths({ data: fourierData(), parameters: freeK0S }, (p, c, d) => {
      const pred = a(p, c, d);
      return pred && pred.turing ? pred : null;
    });
    expect(r.verdict).toBe("cannot reach the measured wavelength");
    expect(r.verdictReason).toMatch(
      /^No state within the bounds reaches the measurements: the best Turing-unstable fit misses by up to/,
    );
  });

  it("a start outside the Turing region is moved inside and said so", () => {
    const r = fitWavelengths(
      {
        data: fourierData(["control"]),
        parameters: {
          D: { mode: "fixed", value: TRUE.D },
          s: { mode: "fixed", value: 0 },
          k0: { mode: "free", start: 0.5, lower: 1e-3, upper: 1, log: true },
        },
      },
      modelA(0.1),
    );
    expect(r.notes).toContain(
      "The given start is outside the Turing region; the fit started from the nearest Turing point of the box sample instead.",
    );
    expect(r.verdict).toBe("fits");
    expect(r.parameters[0].value).toBeCloseTo(TRUE.k0, 6);
  });
});

describe("compareFits", () => {
  // Data from model A with seeded Gaussian noise (σ = 0.3 µm) over six conditions.
  const rng = seedrandom("compare");
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());
  const conditions = ["control", "low", "mid", "high", "top", "max"];
  const data: WavelengthDatum[] = conditions.map((c) => ({
    condition: c,
    wavelengthUm: lambdaA(c) + 0.3 * gauss(),
    uncertaintyUm: 0.3,
    kind: "fourier",
  }));

  it("ranks the generating model first by AICc, weights summing to 1", () => {
    const a = fitWavelengths({ data, parameters: freeK0S }, modelA());
    const b = fitWavelengths(
      {
        data,
        parameters: {
          lambda0: { mode: "free", start: 30, lower: 1, upper: 200 },
          s: { mode: "free", start: 0.1, lower: 0, upper: 5 },
        },
      },
      modelB,
    );
    const cmp = compareFits([
      { label: "B", result: b },
      { label: "A", result: a },
    ]);
    expect(cmp.ranking[0].label).toBe("A");
    expect(cmp.ranking[0].deltaAicc).toBe(0);
    expect(cmp.ranking[0].akaikeWeight!).toBeGreaterThan(0.9);
    expect(cmp.ranking.reduce((s, r) => s + (r.akaikeWeight ?? 0), 0)).toBeCloseTo(1, 12);
    // AICc with n = 6, p = 2: χ² + 4 + 12/3 (Burnham & Anderson 2002).
    expect(a.aicc!).toBeCloseTo(a.chiSquare + 8, 10);
  });
});
