/**
 * The analyses endpoints, with numbers checked against published closed forms.
 */
import { describe, expect, it } from "vitest";
import { setupLabApi } from "../support/lab-api";
import { labSchnakenberg } from "./permission-cases/kinetics";

const lab = setupLabApi({ who: "modeller" });
const api = lab.api;
const KIN = "/api/v1/labs/[labId]/kinetics";
const analysis = (name: string, json: unknown) => api("POST", `/api/v1/labs/[labId]/analyses/${name}`, { json });

describe("analyses", () => {
  it("Schnakenberg: critical ratio d_c of Murray's quadratic, Turing above it, stable below, λ in µm = ℓ·2π/k*", async () => {
    // Murray (2003) Mathematical Biology II §2.4: at a = 0.1, b = 0.9, d_c is the root of
    // 0.64 d² − 5.6 d + 1 = 0 with d f_u + g_v > 0 (hand-computed, as in tests/lib/stability).
    const dc = (5.6 + Math.sqrt(5.6 ** 2 - 4 * 0.64)) / 1.28;
    const r = await analysis("dispersion", {
      kinetics: "schnakenberg",
      parameters: { a: 0.1, b: 0.9, d: 20 },
      lengthScaleUm: 10,
    });
    expect(r.status).toBe(200);
    expect(r.body.classification.classes).toEqual(["turing"]);
    expect(r.body.turingConditions.criticalRatio).toBeCloseTo(dc, 10);
    expect(r.body.turingConditions.conditions.every((c: { satisfied: boolean }) => c.satisfied)).toBe(true);
    // u* = a + b, v* = b/(a + b)² (Murray 2003 eq. 2.39)
    expect(r.body.steadyState.values.u).toBeCloseTo(1, 12);
    expect(r.body.steadyState.values.v).toBeCloseTo(0.9, 12);
    expect(r.body.fastest.wavelengthUm).toBeCloseTo((10 * 2 * Math.PI) / r.body.fastest.kStar, 10); // SCIENCE.md §3
    const below = await analysis("dispersion", { kinetics: "schnakenberg", parameters: { d: 0.9 * dc } });
    expect(below.body.classification.classes).toEqual(["stable"]);
    expect(below.body.fastest).toBeNull();
  });

  it("Brusselator just above b_c = (1 + a√(Du/Dv))² grows at k_c² = a/√(Du Dv) (Prigogine & Lefever 1968)", async () => {
    const a = 1.5,
      Du = 1,
      Dv = 10;
    const bc = (1 + a * Math.sqrt(Du / Dv)) ** 2;
    const r = await analysis("dispersion", { kinetics: "brusselator", parameters: { a, b: bc * (1 + 1e-8), Du, Dv } });
    expect(r.body.classification.classes).toEqual(["turing"]);
    expect(r.body.fastest.kStar).toBeCloseTo(Math.sqrt(a / Math.sqrt(Du * Dv)), 3);
  });

  it("on an interval of length L the admissible modes are k_n = nπ/L (SCIENCE.md §2) and the fastest is among them", async () => {
    const r = await analysis("dispersion", {
      kinetics: "schnakenberg",
      domain: { kind: "interval", length: 50, units: "model" },
    });
    const ks = r.body.admissibleModes.map((m: { k: number }) => m.k);
    ks.slice(0, 5).forEach((k: number, i: number) => expect(k).toBeCloseTo(((i + 1) * Math.PI) / 50, 12));
    const best = r.body.admissibleModes.reduce((x: { sigma: number }, y: { sigma: number }) =>
      y.sigma > x.sigma ? y : x,
    );
    expect(r.body.domain.fastestMode.k).toBeCloseTo(best.k, 12);
    expect(r.body.domain.fastestMode.sigma).toBeCloseTo(best.sigma, 8);
  });

  it("a lab kinetics at a version gives the catalogue's numbers for the same equations (round trip)", async () => {
    const k = (await api("POST", KIN, { json: { definition: labSchnakenberg("Round trip") } })).body;
    const lab = await analysis("dispersion", { kinetics: k.id, version: 1 });
    const cat = await analysis("dispersion", { kinetics: "schnakenberg" });
    expect(lab.body.info).toMatchObject({ kind: "lab", version: 1 });
    expect(lab.body.fastest.kStar).toBeCloseTo(cat.body.fastest.kStar, 8);
    expect((await analysis("dispersion", { kinetics: k.id, version: 2 })).status).toBe(404);
  });

  it("a three-species lab kinetics with cross-diffusion (full matrix) is saved and analysed by the general eigenvalue path", async () => {
    // The Brusselator of the catalogue plus a third, inert species coupled through cross-diffusion only
    // in the third row: its growth rates must equal the catalogue Brusselator's (block-triangular J − k²D, linear algebra).
    const definition = {
      name: "Brusselator + tracer",
      species: ["u", "v", "w"],
      parameters: [
        { name: "a", default: 1.5, min: 0.01, max: 10 },
        { name: "b", default: 2.5, min: 0, max: 100 },
      ],
      reactions: ["a - (b + 1) * u + u^2 * v", "b * u - u^2 * v", "1 - w"],
      diffusion: [
        [1, 0, 0],
        [0, 10, 0],
        [0.5, 0, 1],
      ],
    };
    const k = await api("POST", KIN, { json: { definition } });
    expect(k.status).toBe(201);
    const lab = await analysis("dispersion", { kinetics: k.body.id });
    const cat = await analysis("dispersion", {
      kinetics: "brusselator",
      parameters: { a: 1.5, b: 2.5, Du: 1, Dv: 10 },
    });
    expect(lab.body.turingConditions).toBeNull();
    expect(lab.body.classification.classes).toEqual(cat.body.classification.classes);
    expect(lab.body.fastest.kStar).toBeCloseTo(cat.body.fastest.kStar, 5);
  });

  it("Turing map: cells agree with the dispersion relation at their parameters, fraction and target cells are reported", async () => {
    const r = await analysis("turing-map", {
      kinetics: "schnakenberg",
      x: { name: "a", min: 0.02, max: 0.4, n: 12 },
      y: { name: "b", min: 0.2, max: 2, n: 10, scale: "log" },
      wavenumbers: 64,
      target: { wavelength: 13, tolerance: 2 },
    });
    expect(r.status).toBe(200);
    const { nx, classes, wavelength, x, y, turingFraction, counts, target } = r.body;
    expect(turingFraction).toBeCloseTo(counts.turing / (nx * r.body.ny), 12);
    expect(turingFraction).toBeGreaterThan(0);
    const i = classes.findIndex((c: number) => c === 1);
    const d = await analysis("dispersion", {
      kinetics: "schnakenberg",
      parameters: { a: x.values[i % nx], b: y.values[Math.floor(i / nx)] },
    });
    expect(d.body.classification.classes).toEqual(["turing"]);
    expect(wavelength[i]).toBeCloseTo(d.body.fastest.wavelength, 4);
    expect(target.matchCount).toBe(target.match.filter((m: number) => m === 1).length);
  });

  it("sensitivities: ∂ln λ*/∂ln γ = −1/2 and λ* halves when γ is scaled by 4 (λ ∝ √(D/γ), SCIENCE.md §3)", async () => {
    const r = await analysis("sensitivities", { kinetics: "schnakenberg", scale: { name: "gamma", factor: 4 } });
    expect(r.body.elasticities.elasticities.find((e: { name: string }) => e.name === "gamma").elasticity).toBeCloseTo(
      -0.5,
      5,
    );
    expect(r.body.scaled.ratio).toBeCloseTo(0.5, 10);
    const stable = await analysis("sensitivities", { kinetics: "schnakenberg", parameters: { d: 2 } });
    expect(stable.body).toMatchObject({
      elasticities: null,
      reason: "No mode at k > 0 grows here (stable), so the predicted wavelength and its elasticities are undefined.",
    });
  });

  it("gradient: patterning starts where a linear d(x) crosses d_c (Murray's quadratic), also from a pasted table", async () => {
    const xc = ((8.567627 - 2) / 38) * 1000;
    const lin = await analysis("gradient", {
      kinetics: "schnakenberg",
      parameter: "d",
      profile: { kind: "linear", from: 2, to: 40 },
      length: 1000,
      samples: 201,
      lengthScaleUm: 10,
    });
    expect(Math.abs(lin.body.patterningRegions[0].from - xc)).toBeLessThanOrEqual(5); // one sample spacing
    const table = await analysis("gradient", {
      kinetics: "schnakenberg",
      parameter: "d",
      profile: { kind: "table", text: "position,value\n0,2\n1000,40\n" },
      length: 1000,
      samples: 201,
      lengthScaleUm: 10,
    });
    expect(table.body.patterningRegions).toEqual(lin.body.patterningRegions);
  });

  // Exact sentences naming the field and the limit (common practice, no source).

  it("a lab kinetics of another lab is not found", async () => {
    const k = (await api("POST", KIN, { json: { definition: labSchnakenberg("Private") } })).body;
    const path = "/api/v1/labs/[labId]/analyses/dispersion";
    const res = await lab.raw("POST", path, {
      who: lab.w.outsider,
      params: { labId: lab.w.otherLabId },
      json: { kinetics: k.id },
    });
    expect(res.status).toBe(404);
  });
});
