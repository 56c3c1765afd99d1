import { describe, expect, it } from "vitest";
import { compareFits, FitError, fitWavelengths, type WavelengthFitResult, type WavelengthFitSpec } from "@/lib/fitting";
import { modelA, modelC } from "./synthetic-predictors";

const datum = { condition: "control", wavelengthUm: 30, uncertaintyUm: 1, kind: "fourier" as const };
const free = {
  D: { mode: "fixed" as const, value: 1 },
  k0: { mode: "free" as const, start: 0.05, lower: 1e-3, upper: 1 },
  s: { mode: "fixed" as const, value: 0 },
};

function errorOf(spec: WavelengthFitSpec): FitError {
  try {
    fitWavelengths(spec, modelA());
  } catch (err) {
    expect(err).toBeInstanceOf(FitError);
    return err as FitError;
  }
  throw new Error("no error");
}

describe("fitWavelengths: invalid specs (exact messages)", () => {
  it.each([
    ["no data", { data: [], parameters: free }, "data must hold at least one measurement; got none.", "data"],
    [
      "empty condition",
      { data: [{ ...datum, condition: " " }], parameters: free },
      "data[0].condition must be a non-empty string.",
      "data[0].condition",
    ],
    [
      "negative wavelength",
      { data: [{ ...datum, wavelengthUm: -3 }], parameters: free },
      "data[0].wavelengthUm must be a positive number of µm; got -3.",
      "data[0].wavelengthUm",
    ],
    [
      "zero uncertainty",
      { data: [{ ...datum, uncertaintyUm: 0 }], parameters: free },
      "data[0].uncertaintyUm must be a positive number of µm; got 0.",
      "data[0].uncertaintyUm",
    ],
    [
      "unknown kind",
      { data: [{ ...datum, kind: "peak" }], parameters: free },
      'data[0].kind must be "fourier" or "nearest-neighbour"; got "peak".',
      "data[0].kind",
    ],
    [
      "incompatible kinds in one condition",
      { data: [datum, { ...datum, kind: "nearest-neighbour" }], parameters: free },
      'data[1].kind is "nearest-neighbour" but condition "control" also has "fourier" measurements; use one kind per condition (the spacing conversion assumes hexagonal spots, which a condition mixing both kinds does not establish).',
      "data[1].kind",
    ],
    [
      "no parameters",
      { data: [datum], parameters: {} },
      "parameters must name at least one parameter; got none.",
      "parameters",
    ],
    [
      "unknown mode",
      { data: [datum], parameters: { ...free, k0: { mode: "guess" } } },
      'parameters.k0.mode must be "fixed", "free" or "per-condition"; got "guess".',
      "parameters.k0.mode",
    ],
    [
      "all fixed",
      { data: [datum], parameters: { ...free, k0: { mode: "fixed", value: 0.1 } } },
      "parameters must leave at least one free parameter; all 3 are fixed.",
      "parameters",
    ],
    [
      "start outside the bounds",
      { data: [datum], parameters: { ...free, k0: { mode: "free", start: 7, lower: 0.1, upper: 2 } } },
      "parameters.k0.start (7) must lie within [lower, upper] = [0.1, 2].",
      "parameters.k0.start",
    ],
    [
      "bounds reversed",
      { data: [datum], parameters: { ...free, k0: { mode: "free", start: 1, lower: 5, upper: 1 } } },
      "parameters.k0.lower (5) must be below parameters.k0.upper (1).",
      "parameters.k0.lower",
    ],
    [
      "missing bound",
      { data: [datum], parameters: { ...free, k0: { mode: "free", start: 1, upper: 2 } } },
      "parameters.k0.lower must be a finite number; got undefined.",
      "parameters.k0.lower",
    ],
    [
      "log scale with a zero lower bound",
      { data: [datum], parameters: { ...free, k0: { mode: "free", start: 1, lower: 0, upper: 2, log: true } } },
      "parameters.k0.lower must be positive for a log-scaled parameter; got 0.",
      "parameters.k0.lower",
    ],
    [
      "per-condition start missing a condition",
      {
        data: [datum, { ...datum, condition: "treated" }],
        parameters: { ...free, k0: { mode: "per-condition", start: { control: 0.1 }, lower: 1e-3, upper: 1 } },
      },
      'parameters.k0.start has no value for condition "treated".',
      "parameters.k0.start",
    ],
    [
      "fixed value not a number",
      { data: [datum], parameters: { ...free, D: { mode: "fixed", value: "1" } } },
      "parameters.D.value must be a finite number or one finite number per condition.",
      "parameters.D.value",
    ],
    [
      "bad option",
      { data: [datum], parameters: free, options: { seededStarts: -1 } },
      "options.seededStarts must be an integer from 0 to 100; got -1.",
      "options.seededStarts",
    ],
    [
      "bad reach",
      { data: [datum], parameters: free, options: { reachSigma: 0 } },
      "options.reachSigma must be a positive number; got 0.",
      "options.reachSigma",
    ],
  ])("%s", (_label, spec, message, field) => {
    const err = errorOf(spec as unknown as WavelengthFitSpec);
    expect(err.message).toBe(message);
    expect(err.field).toBe(field);
  });

  it("no Turing region within the bounds: sampled and reported", () => {
    // Model A is Turing only for k ≤ kMax = 1e-6, below the whole box k0 ∈ [1e-3, 1].
    let err: FitError | null = null;
    try {
      fitWavelengths({ data: [datum], parameters: free, options: { turingSamples: 32 } }, modelA(1e-6));
    } catch (e) {
      err = e as FitError;
    }
    expect(err?.code).toBe("no_turing_region");
    expect(err?.message).toBe(
      "No Turing region found within the parameter bounds: none of the 33 sampled points (the start and 32 seeded points in the box) gives a Turing instability in every condition.",
    );
  });
});

describe("compareFits: invalid input (exact messages)", () => {
  const fit = (lambda: number) =>
    fitWavelengths(
      {
        data: [{ ...datum, wavelengthUm: lambda }],
        parameters: { D: { mode: "fixed", value: 1 }, k: { mode: "free", start: 0.05, lower: 1e-3, upper: 1 } },
        options: { profiles: false },
      },
      modelC,
    );
  it("rejects an empty list, repeated labels and fits to different data", () => {
    const a: WavelengthFitResult = fit(30);
    const b: WavelengthFitResult = fit(31);
    expect(() => compareFits([])).toThrow("fits must hold at least one fit; got none.");
    expect(() =>
      compareFits([
        { label: "x", result: a },
        { label: "x", result: a },
      ]),
    ).toThrow('fits[1].label "x" is used twice; labels must be unique.');
    expect(() =>
      compareFits([
        { label: "a", result: a },
        { label: "b", result: b },
      ]),
    ).toThrow(
      'fits[1] ("b") was fitted to different measurements than fits[0] ("a"); models can only be compared on the same data.',
    );
  });
});
