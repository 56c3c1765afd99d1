/**
 * Verification runs with a parameter varying in space, and runs started from a fit.
 */
import { describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeDispersion, computeGradientDispersion } from "@/lib/stability";
import { database } from "@/lib/server/services";
import { setupRunsLab } from "../support/runs";

const { lab, api, finished, RUNS } = setupRunsLab();

describe("a parameter varying in space", () => {
  it("runs with the kinetics page's linear gradient and keeps the local prediction 2π/k*(x) beside the local readout", async () => {
    const gradient = { parameter: "d", profile: { kind: "linear", from: 15, to: 40 } };
    const started = await api("POST", RUNS, {
      json: {
        kinetics: "schnakenberg",
        grid: { lengthUm: [200, 25], cells: [128, 16] },
        endTimeS: 200,
        seed: 4,
        snapshots: 2,
        gradient,
      },
    });
    expect(started.status).toBe(202);
    expect(started.body.spec.spatialParameters).toEqual({
      d: { kind: "linear", axis: "x", fromValue: 15, toValue: 40 },
    });
    // Known answer from the stability core: the local dispersion along the same profile (SCIENCE.md §1, local reading).
    const local = computeGradientDispersion(
      getCatalogueKinetics("schnakenberg"),
      {},
      { parameter: "d", profile: { kind: "linear", from: 15, to: 40 }, length: 200, samples: 101 },
    );
    expect(started.body.plan.gradientPrediction.wavelengths).toEqual(local.points.map((q) => q.wavelength));
    const r = await finished(started.body.id);
    expect(r.status).toBe("succeeded");
    expect(Object.keys(r.files)).toContain("spectrum.json");
  }, 60_000);
});

describe("a run started from a fit", () => {
  it("takes the fit's kinetics, parameters and scales, and compares with the condition's measured mean", async () => {
    const m = await database();
    // A finished fit as the fit job stores it (invented numbers: this tests the wiring, not the fit).
    const prediction = {
      condition: "control",
      parameters: { gamma: 1, a: 0.1, b: 0.9, d: 20 },
      lengthScaleUm: 2,
      timeScaleS: 1,
      classification: "Turing",
      predictedUm: null,
      measuredMeanUm: 24,
      measuredSeUm: 1,
      n: 3,
      curve: { k: [], sigma: [], imSigma: [] },
      bands: [],
      kStar: null,
    };
    const fit = await m.Fit.create({
      labId: lab.w.labId,
      name: "Fixture fit",
      kind: "fit",
      status: "succeeded",
      jobId: null,
      spec: {},
      inputSha256: "0".repeat(64),
      softwareVersion: "test",
      rerunOf: null,
      createdBy: lab.w.people.modeller.userId,
      provenance: {
        data: [
          {
            index: 0,
            source: "typed",
            condition: "control",
            kind: "fourier",
            readoutId: null,
            measure: null,
            filename: null,
            specimenLabel: null,
            studyId: null,
            studyName: null,
            inputSha256: null,
            readoutSoftwareVersion: null,
          },
        ],
        kinetics: [],
        settings: {},
        softwareVersion: "test",
        specSha256: "",
        runner: "in-process",
      },
      result: {
        models: [
          {
            label: "Schnakenberg",
            kinetics: {
              label: "Schnakenberg",
              kind: "catalogue",
              id: "schnakenberg",
              version: null,
              name: "Schnakenberg",
              source: "",
              units: "non-dimensional",
              definitionSha256: null,
            },
            fit: {},
            predictions: [prediction],
            elapsedMs: 1,
          },
        ],
        comparison: null,
        runner: "in-process",
        elapsedMs: 1,
      },
    });
    const started = await api("POST", RUNS, {
      json: {
        kinetics: "ignored",
        grid: { lengthUm: [100, 100], cells: [64, 64] },
        endTimeS: 300,
        seed: 1,
        snapshots: 2,
        fit: { fitId: fit.id, condition: "control" },
      },
    });
    expect(started.status).toBe(202);
    expect(started.body.spec.parameters).toEqual({ gamma: 1, a: 0.1, b: 0.9, d: 20 });
    expect(started.body.spec.scales).toEqual({ lengthScaleUm: 2, timeScaleS: 1 });
    expect(started.body.plan.fromFit).toMatchObject({
      fitName: "Fixture fit",
      condition: "control",
      measuredMeanUm: 24,
      n: 3,
    });
    // 2π/k* in µm = ℓ · 2π/k* in model units (SCIENCE.md §3).
    const linear = computeDispersion(getCatalogueKinetics("schnakenberg"), { a: 0.1, b: 0.9, d: 20 });
    expect(started.body.predictedWavelength).toBeCloseTo(2 * linear.fastest!.wavelength, 9);
    const r = await finished(started.body.id);
    expect(r.lengthUnit).toBe("µm");
    expect(r.wavelength).toBeCloseTo(2 * r.result!.readout!.wavelength.wavelengthUm!, 9);
    expect(r.result!.measurementComparison!.sentence).toMatch(
      /^The simulated wavelength .* (agrees with|disagrees with) the measured mean of “control” \(n = 3\), 24 ± 1 µm/,
    );
    const missing = await api("POST", RUNS, {
      json: {
        kinetics: "x",
        grid: { lengthUm: [50], cells: [32] },
        endTimeS: 1,
        fit: { fitId: fit.id, condition: "treated" },
      },
    });
    expect(missing.body.error.message).toBe(
      "Condition of the fit: the fit has no condition “treated” (it has “control”).",
    );
  }, 60_000);
});
