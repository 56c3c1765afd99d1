import { describe, expect, it } from "vitest";
import { fitWavelengths, type ParameterSetting } from "@/lib/fitting";
import { createKineticsPredictor } from "@/lib/fitting/kinetics-predictor";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeDispersion } from "@/lib/stability";

/** Relative difference |a/b − 1|. */

// Table: (kinetics, parameters, predictor options). Reference: the general path (computeDispersion)
// of the same predictor, which the fast path must reproduce.
const CASES: [string, string, Record<string, number>, { lengthScaleUm?: number; gridSize?: number }][] = [
  ["schnakenberg, fit truth b = 0.9", "schnakenberg", { gamma: 1, a: 0.1, d: 20, b: 0.9 }, { lengthScaleUm: 10 }],
  [
    "schnakenberg, b = 1.2, coarse grid",
    "schnakenberg",
    { gamma: 1, a: 0.1, d: 20, b: 1.2 },
    { lengthScaleUm: 10, gridSize: 64 },
  ],
  [
    "schnakenberg, near the Turing edge a = 0.048",
    "schnakenberg",
    { gamma: 0.77, a: 0.048, d: 10.4, b: 1 },
    { lengthScaleUm: 10 },
  ],
  ["schnakenberg, d = 2 (stable: no prediction)", "schnakenberg", { d: 2 }, { lengthScaleUm: 10 }],
  ["schnakenberg, fitted length scale", "schnakenberg", { lengthScaleUm: 7.5, gamma: 2 }, {}],
  ["schnakenberg, no length scale (no µm prediction)", "schnakenberg", {}, {}],
  ["brusselator b = 4 (Turing + Hopf: not a Turing prediction)", "brusselator", { b: 4 }, { lengthScaleUm: 1 }],
  ["gierer-meinhardt defaults", "gierer-meinhardt", {}, { lengthScaleUm: 3 }],
  ["thomas defaults", "thomas", {}, { lengthScaleUm: 3 }],
  ["gray-scott (dimensional, 3 states)", "gray-scott", { F: 0.02, k: 0.04, Dv: 2e-6 }, {}],
  ["brusselator-three-species (general path only)", "brusselator-three-species", {}, { lengthScaleUm: 2 }],
];

describe("createKineticsPredictor: fast fastest-mode path against computeDispersion", () => {
  it.each(CASES)("%s: same wavelength (1e-9 relative) and Turing flag", (_, id, params, options) => {
    const kinetics = getCatalogueKinetics(id as Parameters<typeof getCatalogueKinetics>[0]);
    const fast = createKineticsPredictor(kinetics, options)(params, "c", undefined);
    const general = createKineticsPredictor(kinetics, { ...options, fastPath: false })(params, "c", undefined);
    if (general === null) expect(fast).toBeNull();
    else {
      expect(fast).not.toBeNull();
      expect(fast!.wavelengthUm).toBeWithinRelative(general.wavelengthUm, 1e-9);
      expect(fast!.turing).toBe(general.turing);
    }
  });

  it("the general path is 2πℓ/k* of computeDispersion's fastest mode (so the table checks the stability engine's numbers)", () => {
    const r = computeDispersion(
      getCatalogueKinetics("schnakenberg"),
      { gamma: 1, a: 0.1, d: 20, b: 0.9 },
      { lengthScaleUm: 10 },
    );
    const p = createKineticsPredictor(getCatalogueKinetics("schnakenberg"), { lengthScaleUm: 10 })(
      { gamma: 1, a: 0.1, d: 20, b: 0.9 },
      "c",
      undefined,
    )!;
    expect(p.wavelengthUm).toBeWithinRelative((2 * Math.PI * 10) / r.fastest!.kStar, 1e-12); // definition λ = 2π/k (SCIENCE.md)
    expect(p.turing).toBe(true);
  });

  it("a finite domain takes the general path in both (fastest admissible mode)", () => {
    const k = getCatalogueKinetics("schnakenberg");
    const domain = { kind: "interval" as const, length: 200 };
    const a = createKineticsPredictor(k, { lengthScaleUm: 10 })({ gamma: 1, a: 0.1, d: 20, b: 1 }, "c", domain);
    const b = createKineticsPredictor(k, { lengthScaleUm: 10, fastPath: false })(
      { gamma: 1, a: 0.1, d: 20, b: 1 },
      "c",
      domain,
    );
    expect(a).toEqual(b);
    const r = computeDispersion(k, { gamma: 1, a: 0.1, d: 20, b: 1 }, { lengthScaleUm: 10, domain });
    expect(a!.wavelengthUm).toBe(r.domain!.fastestMode.wavelengthUm); // admissible k_n = nπ/L (SCIENCE.md §2), not the unbounded k*
  });

  it("raises the same errors on both paths (parameter range, scales)", () => {
    const k = getCatalogueKinetics("schnakenberg");
    const calls: [Record<string, number>, { lengthScaleUm?: number }][] = [
      [{ a: -1 }, { lengthScaleUm: 10 }],
      [{ nope: 1 }, { lengthScaleUm: 10 }],
      [{ lengthScaleUm: -3 }, {}],
    ];
    for (const [params, options] of calls) {
      const message = (fastPath: boolean) => {
        try {
          createKineticsPredictor(k, { ...options, fastPath })(params, "c", undefined);
          return "no error";
        } catch (err) {
          return (err as Error).message;
        }
      };
      expect(message(true)).not.toBe("no error");
      expect(message(true)).toBe(message(false));
    }
  });

  it("a whole wavelength fit with profiles reports the same numbers on both paths", () => {
    // Round trip as in kinetics-round-trip.test.ts (invented truth γ = 1, a = 0.1, d = 20, data × 1.01).
    const k = getCatalogueKinetics("schnakenberg");
    const fast = createKineticsPredictor(k, { lengthScaleUm: 10, gridSize: 32 });
    const general = createKineticsPredictor(k, { lengthScaleUm: 10, gridSize: 32, fastPath: false });
    const b: Record<string, number> = { c0: 0.9, c1: 1.1 };
    const data = Object.keys(b).map((c) => ({
      condition: c,
      wavelengthUm: general({ gamma: 1, a: 0.1, d: 20, b: b[c] }, c, undefined)!.wavelengthUm * 1.01,
      uncertaintyUm: 1,
      kind: "fourier" as const,
    }));
    const parameters: Record<string, ParameterSetting> = {
      gamma: { mode: "free", start: 2, lower: 0.1, upper: 10, log: true },
      d: { mode: "free", start: 30, lower: 5, upper: 200, log: true },
      a: { mode: "fixed", value: 0.1 },
      b: { mode: "fixed", value: b },
    };
    const spec = { data, parameters, options: { turingSamples: 16 } };
    const rFast = fitWavelengths(spec, fast);
    const rGeneral = fitWavelengths(spec, general);
    expect(rFast.parameters[0].interval95).not.toBeNull();
    expect(rFast).toEqual(rGeneral);
  });
});
