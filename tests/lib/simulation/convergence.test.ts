import { describe, expect, it } from "vitest";
import {
  SCHEME_ORDER,
  schnakenbergReaction,
  schnakenbergSteadyState,
  simulateReactionDiffusion,
  type SchemeName,
} from "@/lib/simulation";

// Self-convergence: with global error C hᵖ, (u_h − u_{h/2}) / (u_{h/2} − u_{h/4}) → 2ᵖ
// (Richardson; e.g. LeVeque 2007, Finite Difference Methods for ODEs and PDEs, App. A).
const [us, vs] = schnakenbergSteadyState(0.1, 0.9);
const N = 64,
  L = 30;
const x = (j: number) => ((j + 0.5) * L) / N;
const u0 = Float64Array.from(
  { length: N },
  (_, j) => us + 0.3 * Math.cos((3 * Math.PI * x(j)) / L) + 0.2 * Math.cos((7 * Math.PI * x(j)) / L),
);
const v0 = Float64Array.from({ length: N }, (_, j) => vs + 0.1 * Math.cos((5 * Math.PI * x(j)) / L));

function runWith(scheme: SchemeName, dtS: number): Float64Array[] {
  return simulateReactionDiffusion(schnakenbergReaction, {
    grid: { lengthUm: [L], cells: [N] },
    diffusionUm2PerS: [1, 10],
    params: { a: 0.1, b: 0.9, gamma: 1 },
    initial: { kind: "fields", fields: [u0, v0] },
    endTimeS: 4,
    dtS,
    stiffnessSafety: 2,
    scheme,
  }).fields;
}

function distance(p: Float64Array[], q: Float64Array[]): number {
  let s = 0;
  p.forEach((f, k) => f.forEach((v, i) => (s += (v - q[k][i]) ** 2)));
  return Math.sqrt(s);
}

describe("halving Δt changes the result by the scheme's order", () => {
  it.each(["implicit-euler", "integrating-factor", "etd2"] as const)("%s", (scheme) => {
    const [r1, r2, r3] = [0.1, 0.05, 0.025].map((h) => runWith(scheme, h));
    const ratio = distance(r1, r2) / distance(r2, r3);
    const expected = 2 ** SCHEME_ORDER[scheme];
    // ±10 % around 2ᵖ: common practice, no source.
    expect(ratio).toBeGreaterThan(0.9 * expected);
    expect(ratio).toBeLessThan(1.1 * expected);
  });
});
