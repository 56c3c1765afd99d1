/**
 * Fits through the API: every bad input is refused before a job starts, naming the field.
 */
import { describe, expect, it } from "vitest";
import { database } from "@/lib/server/services";
import { FITS, gammaPerCondition, roundTrip, roundTripData, setupFitsLab } from "../support/fits";

const { api } = setupFitsLab();

describe("bad input is refused before a job starts, naming the field", () => {
  const model = roundTrip.models[0];
  const refused = async (body: unknown) => {
    const before = await (await database()).Job.count();
    const r = await api("POST", FITS, { json: body });
    expect(await (await database()).Job.count()).toBe(before);
    return {
      status: r.status,
      error: ((await r.res.json()) as { error: { message: string; details?: { field?: string } } }).error,
    };
  };
  const cases: [string, unknown, number, string][] = [
    [
      "no data selected",
      { ...roundTrip, data: [] },
      400,
      "Measurements: select at least one readout or type a measured wavelength",
    ],
    [
      "incompatible data kinds in one condition",
      { ...roundTrip, data: [roundTripData[0], { ...roundTripData[1], kind: "nearest-neighbour" }] },
      422,
      'Kind of measurement 2 is "nearest-neighbour" but condition "control" also has "fourier" measurements; use one kind per condition (the spacing conversion assumes hexagonal spots, which a condition mixing both kinds does not establish).',
    ],
    [
      "bounds that exclude the start",
      {
        ...roundTrip,
        models: [{ ...model, parameters: { gamma: { mode: "free", start: 5, lower: 10, upper: 1000 } } }],
      },
      422,
      "Start value of gamma in the first kinetics (5) must lie within [lower, upper] = [10, 1000].",
    ],
    [
      "all parameters fixed",
      { ...roundTrip, models: [{ ...model, parameters: { gamma: { mode: "fixed", value: 100 } } }] },
      422,
      "Parameters of the first kinetics must leave at least one free parameter; all 4 are fixed.",
    ],
    [
      "no Turing region in the bounds",
      {
        ...roundTrip,
        models: [
          {
            ...model,
            parameters: {
              gamma: { mode: "free", start: 100, lower: 10, upper: 1000 },
              d: { mode: "free", start: 2, lower: 1, upper: 3 },
            },
          },
        ],
      },
      422,
      "Parameters of the first kinetics: no Turing region within the bounds of Schnakenberg: none of the 65 sampled points (the start and 64 seeded points in the box) is Turing-unstable in every condition; widen the bounds or free other parameters",
    ],
    [
      "an unknown parameter",
      { ...roundTrip, models: [{ ...model, parameters: { Du: { mode: "fixed", value: 1 } } }] },
      422,
      "Parameter Du of the first kinetics: Schnakenberg has no parameter “Du” (its parameters: gamma, a, b, d; or length scale, time scale)",
    ],
    [
      "a non-dimensional kinetics without a length scale",
      { ...roundTrip, models: [{ kinetics: "schnakenberg", parameters: gammaPerCondition }] },
      422,
      "Length scale of the first kinetics (µm): Schnakenberg is non-dimensional; give a length scale ℓ (µm per model length) or fit length scale as a parameter, so its wavelength can be compared in µm",
    ],
    [
      "a typed datum without its uncertainty",
      { ...roundTrip, data: [{ condition: "control", kind: "fourier", wavelengthUm: 40 }] },
      400,
      "Uncertainty of measurement 1 (µm): a typed measurement needs uncertainty (or give a readout instead)",
    ],
    [
      "an unknown readout",
      { ...roundTrip, data: [{ readoutId: "00000000-0000-4000-8000-000000000000" }] },
      422,
      "Readout of measurement 1: no readout with this id in this lab",
    ],
    [
      "an unknown kinetics",
      { ...roundTrip, models: [{ ...model, kinetics: "no-such-model" }] },
      422,
      "The first kinetics: no kinetics “no-such-model” in the catalogue or this lab",
    ],
  ];
  for (const [what, body, status, message] of cases) {
    it(what, async () => {
      const r = await refused(body);
      expect(r.status).toBe(status);
      expect(r.error.message).toBe(message);
    });
  }
});
