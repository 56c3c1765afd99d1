import { describe, expect, it } from "vitest";
import { fitWavelengths } from "@/lib/fitting";
import { createKineticsPredictor } from "@/lib/fitting/kinetics-predictor";
import { getCatalogueKinetics } from "@/lib/kinetics";

describe("fitWavelengths with a real catalogue kinetics (Schnakenberg, stability engine)", () => {
  it("recovers γ, a and d from wavelengths it generated itself at four values of b", () => {
    // Round trip: data are the engine's own 2π/k* (ℓ = 10 µm) at the invented truth γ = 1, a = 0.1, d = 20.
    const predictor = createKineticsPredictor(getCatalogueKinetics("schnakenberg"), {
      lengthScaleUm: 10,
      gridSize: 64,
    });
    const b: Record<string, number> = { c0: 0.9, c1: 1.0, c2: 1.1, c3: 1.2 };
    const truth = { gamma: 1, a: 0.1, d: 20 };
    const data = Object.keys(b).map((c) => ({
      condition: c,
      wavelengthUm: predictor({ ...truth, b: b[c] }, c, undefined)!.wavelengthUm,
      uncertaintyUm: 1,
      kind: "fourier" as const,
    }));
    const r = fitWavelengths(
      {
        data,
        parameters: {
          gamma: { mode: "free", start: 2, lower: 0.1, upper: 10, log: true },
          a: { mode: "free", start: 0.2, lower: 0.01, upper: 0.5 },
          d: { mode: "free", start: 30, lower: 5, upper: 200, log: true },
          b: { mode: "fixed", value: b },
        },
        options: { profiles: false },
      },
      predictor,
    );
    expect(r.verdict).toBe("fits");
    expect(r.parameters[0].value).toBeCloseTo(1, 3);
    expect(r.parameters[1].value).toBeCloseTo(0.1, 3);
    expect(r.parameters[2].value / 20).toBeCloseTo(1, 3);
    expect(Object.values(r.turingAtFit).every(Boolean)).toBe(true);
  });
});
