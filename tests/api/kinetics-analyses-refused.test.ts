/**
 * The analyses endpoints refuse bad input with exact messages naming the field.
 */
import { describe, expect, it } from "vitest";
import { setupLabApi } from "../support/lab-api";

const lab = setupLabApi({ who: "modeller" });
const api = lab.api;
const analysis = (name: string, json: unknown) => api("POST", `/api/v1/labs/[labId]/analyses/${name}`, { json });

describe("analyses", () => {
  it.each([
    [
      "a value sent as text",
      "dispersion",
      { kinetics: "schnakenberg", parameters: { a: "NaN" } },
      400,
      'Parameter a: each parameter value must be a finite number (text such as "NaN" is not a number)',
    ],
    [
      "a parameter out of range",
      "dispersion",
      { kinetics: "schnakenberg", parameters: { a: 500 } },
      400,
      "Parameter a = 500 is outside its allowed range [0, 100].",
    ],
    [
      "an unknown kinetics",
      "dispersion",
      { kinetics: "turing-1952" },
      400,
      'Unknown kinetics "turing-1952"; the catalogue has: schnakenberg, gierer-meinhardt, gierer-meinhardt-saturation, brusselator, lengyel-epstein, fitzhugh-nagumo, thomas, gray-scott, brusselator-three-species.',
    ],
    [
      "no steady state",
      "dispersion",
      { kinetics: "schnakenberg", parameters: { a: 0, b: 0 } },
      422,
      "No homogeneous steady state: the closed form of Schnakenberg has no non-negative solution for these parameters.",
    ],
    [
      "a negative domain",
      "dispersion",
      { kinetics: "schnakenberg", domain: { kind: "interval", length: -3 } },
      400,
      "Domain length must be above 0",
    ],
    [
      "a map too large",
      "turing-map",
      { kinetics: "schnakenberg", x: { name: "a", min: 0, max: 1, n: 201 }, y: { name: "b", min: 0, max: 1, n: 200 } },
      413,
      "The map has 201 × 200 = 40200 cells; an interactive map has at most 40000 (e.g. 200 × 200).",
    ],
    [
      "too many wavenumbers",
      "turing-map",
      {
        kinetics: "schnakenberg",
        x: { name: "a", min: 0, max: 1, n: 5 },
        y: { name: "b", min: 0, max: 1, n: 5 },
        wavenumbers: 500,
      },
      413,
      "Wavenumbers per cell: 500 asked; an interactive map has at most 200 per cell.",
    ],
    [
      "one parameter on both axes",
      "turing-map",
      { kinetics: "schnakenberg", x: { name: "a", min: 0, max: 1, n: 5 }, y: { name: "a", min: 0, max: 1, n: 5 } },
      400,
      'The two axes sweep the same parameter "a"; choose two different parameters.',
    ],
    [
      "a map over the time limit",
      "turing-map",
      {
        kinetics: "brusselator-three-species",
        x: { name: "a", min: 1, max: 3, n: 200 },
        y: { name: "b", min: 5, max: 15, n: 200 },
        wavenumbers: 200,
      },
      422,
      "The Turing map exceeded its time limit of 1000 ms.",
    ],
    [
      "too many gradient samples",
      "gradient",
      {
        kinetics: "schnakenberg",
        parameter: "d",
        profile: { kind: "linear", from: 2, to: 40 },
        length: 10,
        samples: 500,
      },
      413,
      "Positions along the tissue: 500 positions asked; the limit is 201.",
    ],
    [
      "a bad table row",
      "gradient",
      { kinetics: "schnakenberg", parameter: "d", profile: { kind: "table", text: "0,2\n5;x\n" }, length: 10 },
      400,
      'Position, value table line 2: expected two numbers "position,value" (got “5;x”)',
    ],
  ])("refuses %s", async (_what, name, body, status, message) => {
    const r = await analysis(name, body);
    expect(r.status).toBe(status);
    expect(r.body.error.message).toBe(message);
  });
});
