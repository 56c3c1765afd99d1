import { describe, expect, it } from "vitest";
import { compileKinetics, getCatalogueKinetics, resolveParameters } from "@/lib/kinetics";
import { computeDispersion } from "@/lib/stability";
import { analyseCell2x2 } from "@/lib/stability/cell-2x2";
import { computeFastestMode, createFastestModeWorkspace } from "@/lib/stability/fastest-mode";

// Newton-only kinetics (no closed form): a linear system with its single state at u = 1, v = 1.
const newtonOnly = compileKinetics({
  name: "linear test",
  species: ["u", "v"],
  parameters: [{ name: "s", default: 1 }],
  reactions: ["s * (u - 1) - (v - 1)", "3 * (u - 1) - 2 * (v - 1)"],
  diffusion: [1, 20],
});

// Table: catalogue defaults (all Turing) plus sets that are stable, Hopf or unstable at k = 0, and a multi-state kinetics.
// Reference: computeDispersion itself (the general path this function must reproduce).
const CASES: [string, ReturnType<typeof getCatalogueKinetics>, Record<string, number>][] = [
  ["schnakenberg defaults", getCatalogueKinetics("schnakenberg"), {}],
  ["schnakenberg fit truth, b = 1.2", getCatalogueKinetics("schnakenberg"), { gamma: 1, a: 0.1, d: 20, b: 1.2 }],
  ["schnakenberg d = 2 (no Turing)", getCatalogueKinetics("schnakenberg"), { d: 2 }],
  ["schnakenberg a = 0.5 (no Turing)", getCatalogueKinetics("schnakenberg"), { a: 0.5, d: 20 }],
  ["gierer-meinhardt defaults", getCatalogueKinetics("gierer-meinhardt"), {}],
  ["brusselator defaults", getCatalogueKinetics("brusselator"), {}],
  ["brusselator b = 4 (Hopf + Turing)", getCatalogueKinetics("brusselator"), { b: 4 }],
  ["brusselator b = 1 (stable)", getCatalogueKinetics("brusselator"), { b: 1 }],
  ["lengyel-epstein defaults", getCatalogueKinetics("lengyel-epstein"), {}],
  ["fitzhugh-nagumo defaults", getCatalogueKinetics("fitzhugh-nagumo"), {}],
  ["thomas defaults", getCatalogueKinetics("thomas"), {}],
  ["gray-scott defaults (3 states)", getCatalogueKinetics("gray-scott"), {}],
  ["gray-scott F = 0.03, k = 0.06", getCatalogueKinetics("gray-scott"), { F: 0.03, k: 0.06 }],
  [
    "gray-scott F = 0.01, k = 0.04 (state 1 chosen: state 0 unstable at k = 0)",
    getCatalogueKinetics("gray-scott"),
    { F: 0.01, k: 0.04 },
  ],
  [
    "gray-scott F = 0.02, k = 0.05 (state 2 chosen: 0 is Turing + Hopf, 1 unstable)",
    getCatalogueKinetics("gray-scott"),
    { F: 0.02, k: 0.05 },
  ],
  [
    "gray-scott F = 0.02, k = 0.04, Dv = 2e-6 (3 states, Turing)",
    getCatalogueKinetics("gray-scott"),
    { F: 0.02, k: 0.04, Dv: 2e-6 },
  ],
  [
    "Newton-only linear kinetics, s = 1 (Turing: 20s − 2 > 0 and (20s − 2)² > 80(3 − 2s), Murray 2003 eq. 2.49)",
    newtonOnly as ReturnType<typeof getCatalogueKinetics>,
    { s: 1 },
  ],
  [
    "Newton-only linear kinetics, s = 1.8 (det J = 3 − 2s < 0: unstable at k = 0)",
    newtonOnly as ReturnType<typeof getCatalogueKinetics>,
    { s: 1.8 },
  ],
];

describe("computeFastestMode (two species, diagonal D, unbounded domain)", () => {
  it.each(CASES)(
    "%s: same state, flags, k* and σ(k*) as computeDispersion (k* to 1e-9 relative)",
    (_, kinetics, params) => {
      for (const gridSize of [200, 64]) {
        const r = computeDispersion(kinetics, params, { gridSize });
        const m = computeFastestMode(kinetics, resolveParameters(kinetics, params), gridSize)!;
        expect(m).not.toBeNull();
        expect(m.stateIndex).toBe(r.steadyState.index);
        expect(m.flags).toBe(r.classification.flags);
        if (r.fastest === null) {
          expect(m.kStar).toBeNaN();
          expect(m.kind).toBeNull();
        } else {
          expect(m.kStar).toBeWithinRelative(r.fastest.kStar, 1e-9);
          expect(m.sigmaStar).toBeWithinRelative(r.fastest.sigmaStar, 1e-9);
          expect(m.kind).toBe(r.fastest.kind);
        }
      }
    },
  );

  it("gives the same answers with a reused workspace, whatever the order of calls", () => {
    const ws = createFastestModeWorkspace(200);
    const fresh = CASES.map(([, k, p]) => computeFastestMode(k, resolveParameters(k, p)));
    const reused = [...CASES]
      .reverse()
      .map(([, k, p]) => computeFastestMode(k, resolveParameters(k, p), 200, ws))
      .reverse();
    expect(reused).toEqual(fresh);
  });

  it("k* agrees with the closed-form stationary point of σ(k²) (Murray 2003 §2.3, as in cell-2x2) to golden-section precision", () => {
    // Golden section on the flat top of σ resolves k* only to ~√ε relative; 1e-7 leaves a margin (measured ≤ 2e-8).
    let checked = 0;
    for (const [, kinetics, params] of CASES) {
      const p = resolveParameters(kinetics, params);
      const m = computeFastestMode(kinetics, p)!;
      if (!(m.kStar > 0)) continue;
      const r = computeDispersion(kinetics, params);
      const J = r.jacobian.flat();
      const [Du, Dv] = [r.diffusion[0][0], r.diffusion[1][1]];
      const peak = { k: NaN, sigma: -Infinity };
      analyseCell2x2(J, Du, Dv, peak);
      expect(m.kStar).toBeWithinRelative(peak.k, 1e-7);
      checked++;
    }
    expect(checked).toBeGreaterThanOrEqual(10);
  });

  it("returns null where it does not apply, so the caller falls back to computeDispersion", () => {
    const three = getCatalogueKinetics("brusselator-three-species");
    expect(computeFastestMode(three, resolveParameters(three, {}))).toBeNull(); // 3 species
    const s = getCatalogueKinetics("schnakenberg");
    expect(computeFastestMode(s, resolveParameters(s, { a: 0, b: 0 }))).toBeNull(); // u* = a + b = 0: no steady state (Murray 2003 eq. 2.39)
    expect(computeFastestMode(s, resolveParameters(s, {}), 8)).toBeNull(); // grid below computeDispersion's minimum of 16
    expect(computeFastestMode(s, resolveParameters(s, {}), 200, createFastestModeWorkspace(64))).toBeNull(); // workspace too small
    const cross = compileKinetics({
      name: "cross",
      species: ["u", "v"],
      parameters: [],
      reactions: ["1 - u", "u - v"],
      diffusion: [
        [1, 0.1],
        [0, 2],
      ],
    });
    expect(computeFastestMode(cross, [])).toBeNull(); // cross-diffusion: not diagonal
    const zero = compileKinetics({
      name: "z",
      species: ["u", "v"],
      parameters: [{ name: "D", default: 0 }],
      reactions: ["1 - u", "u - v"],
      diffusion: [1, "D"],
    });
    expect(computeFastestMode(zero, [0])).toBeNull(); // zero diffusivity: computeDispersion raises the error
  });
});
