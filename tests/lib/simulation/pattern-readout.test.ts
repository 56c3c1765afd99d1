import { describe, expect, it } from "vitest";
import { getCatalogueKinetics, resolveParameters } from "@/lib/kinetics";
import { readWavelength } from "@/lib/readout";
import {
  createReactionSystemFromKinetics,
  readKineticsDiffusion,
  readKineticsSteadyState,
  simulateReactionDiffusion,
} from "@/lib/simulation";

/** Fastest-growing k² of a 2×2 system on a fine grid (SCIENCE.md §1, closed form of σ). */
function fastestK2(j: number[], du: number, dv: number): number {
  let best = -Infinity,
    arg = 0;
  for (let i = 1; i < 20_000; i++) {
    const k2 = i * 1e-4;
    const tr = j[0] + j[3] - k2 * (du + dv);
    const det = (j[0] - k2 * du) * (j[3] - k2 * dv) - j[1] * j[2];
    const disc = (tr * tr) / 4 - det;
    const s = disc >= 0 ? tr / 2 + Math.sqrt(disc) : tr / 2;
    if (s > best) [best, arg] = [s, k2];
  }
  return arg;
}

// Pattern selection: a quadratic nonlinearity favours hexagonal spots, a nonlinearity odd under
// c − c* → −(c − c*) has no quadratic term and favours stripes (Ermentrout B. (1991) Proc. R. Soc. A
// 434:413; Cross M.C. & Hohenberg P.C. (1993) Rev. Mod. Phys. 65:851, §VI).
const cases: { id: string; values: Record<string, number>; endTimeS: number; expect: "spots" | "stripes" }[] = [
  { id: "schnakenberg", values: { gamma: 1, a: 0.1, b: 0.9, d: 20 }, endTimeS: 300, expect: "spots" },
  { id: "fitzhugh-nagumo", values: { gamma: 1, eps: 3, a: 0, b: 0.5, d: 20 }, endTimeS: 100, expect: "stripes" },
];

describe("a long run ends in the pattern its nonlinearity selects, read by the tissue readout", () => {
  it.each(cases)("$id → $expect", (c) => {
    const k = getCatalogueKinetics(c.id);
    const p = resolveParameters(k, c.values);
    const params = Object.fromEntries(k.parameters.map((s, i) => [s.name, p[i]]));
    const steady = readKineticsSteadyState(k, p)!;
    const N = 64,
      L = 100;
    const r = simulateReactionDiffusion(createReactionSystemFromKinetics(k), {
      grid: { lengthUm: [L, L], cells: [N, N] },
      diffusionUm2PerS: readKineticsDiffusion(k, p),
      params,
      initial: { kind: "steady-state-noise", steadyState: steady, noiseAmplitude: 0.01, seed: 1 },
      endTimeS: c.endTimeS,
      stiffnessSafety: 0.25,
    });
    const u = r.fields[0];
    const min = Math.min(...u),
      max = Math.max(...u);
    const readout = readWavelength(
      { width: N, height: N, data: Float32Array.from(u, (v) => (v - min) / (max - min)) },
      { pixelSizeUm: L / N },
    );
    expect(readout.periodFound).toBe(true);
    const { h2, h6 } = readout.symmetryScores;
    if (c.expect === "spots") expect(h6).toBeGreaterThan(5 * h2);
    else {
      expect(h2).toBeGreaterThan(1.2 * h6);
      expect(readout.symmetry).not.toBe("hexagonal");
    }
    // The final wavelength stays near the linear prediction 2π/k*; 20 %: common practice, no source
    // (nonlinear selection shifts it, Murray 2003 ch. 2).
    const j = new Float64Array(4);
    k.jacobian(steady, p, j);
    const d = readKineticsDiffusion(k, p) as number[]; // catalogue Gierer–Meinhardt: diagonal
    const predicted = (2 * Math.PI) / Math.sqrt(fastestK2(Array.from(j), d[0], d[1]));
    expect(Math.abs(readout.wavelengthUm! / predicted - 1)).toBeLessThan(0.2);
  });
});
