import { describe, expect, it } from "vitest";
import { getCatalogueKinetics, KineticsInputError } from "@/lib/kinetics";
import { computeElasticities, computeGradientDispersion, predictWavelengthAfterScaling } from "@/lib/stability";

const schnakenberg = getCatalogueKinetics("schnakenberg");

describe("sensitivities", () => {
  it("∂ln λ*/∂ln γ = −1/2 (λ ∝ √(D/γ), SCIENCE.md §3 / Murray 2003 §2.4) and λ halves when γ × 4", () => {
    const r = computeElasticities(schnakenberg, {});
    const g = r.elasticities.find((e) => e.name === "gamma")!;
    expect(g.elasticity!).toBeCloseTo(-0.5, 5); // k* from golden section is good to ~√ε relative, so ~1e-7 here
    expect(predictWavelengthAfterScaling(schnakenberg, {}, "gamma", 4).ratio!).toBeCloseTo(0.5, 10);
  });

  it("Brusselator: elasticities of Du and Dv sum to 1/2 (dimensional analysis: D → cD scales k by 1/√c)", () => {
    const r = computeElasticities(getCatalogueKinetics("brusselator"), {});
    const e = Object.fromEntries(r.elasticities.map((x) => [x.name, x.elasticity]));
    expect(e.Du! + e.Dv!).toBeCloseTo(0.5, 6);
  });

  it("explains parameters it cannot differentiate", () => {
    const r = computeElasticities(getCatalogueKinetics("fitzhugh-nagumo"), {});
    expect(r.elasticities.find((e) => e.name === "a")).toEqual({
      name: "a",
      value: 0,
      elasticity: null,
      reason: "parameter is 0, so ln p is undefined",
    });
    expect(() => computeElasticities(schnakenberg, { d: 2 })).toThrow(
      new KineticsInputError(
        "parameters",
        "No growing mode at k > 0 here, so the predicted wavelength and its elasticities are undefined.",
      ),
    );
  });
});

describe("gradients", () => {
  it("a linear gradient of d switches patterning on where d crosses d_c ≈ 8.5676 (Murray's quadratic, see turing-references)", () => {
    const r = computeGradientDispersion(
      schnakenberg,
      {},
      { parameter: "d", profile: { kind: "linear", from: 2, to: 40 }, length: 1000, samples: 201, lengthScaleUm: 10 },
    );
    expect(r.positionUnits).toBe("um");
    expect(r.patterningRegions).toHaveLength(1);
    const xc = ((8.567627 - 2) / 38) * 1000; // where d(x) = d_c
    expect(Math.abs(r.patterningRegions[0].from - xc)).toBeLessThanOrEqual(5); // one sample spacing
    expect(r.patterningRegions[0].to).toBe(1000);
    // local wavelength in µm is ℓ times the model-unit wavelength (SCIENCE.md §3)
    const last = r.points.at(-1)!;
    expect(last.wavelengthUm!).toBeCloseTo(last.wavelength! * 10, 10);
  });

  it("exponential and table profiles give the values they describe", () => {
    const e = computeGradientDispersion(
      schnakenberg,
      {},
      { parameter: "d", profile: { kind: "exponential", source: 40, decayLength: 100 }, length: 200, samples: 3 },
    );
    expect(e.points.map((p) => p.value)).toEqual([40, 40 * Math.exp(-1), 40 * Math.exp(-2)]);
    const t = computeGradientDispersion(
      schnakenberg,
      {},
      { parameter: "d", profile: { kind: "table", positions: [0, 10], values: [5, 25] }, length: 10, samples: 3 },
    );
    expect(t.points.map((p) => p.value)).toEqual([5, 15, 25]);
    expect(t.points[0].classes).toEqual(["stable"]);
    expect(() =>
      computeGradientDispersion(
        schnakenberg,
        {},
        { parameter: "d", profile: { kind: "table", positions: [0, 0], values: [1, 2] }, length: 1 },
      ),
    ).toThrow("profile.positions must increase strictly.");
  });
});
