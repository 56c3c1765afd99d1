import { describe, expect, it } from "vitest";
import {
  schnakenbergReaction,
  schnakenbergSteadyState,
  simulateReactionDiffusion,
  type SchemeName,
} from "@/lib/simulation";

// Schnakenberg in γ-form, a = 0.1, b = 0.9, γ = 1, D = diag(1, 10): a Turing-unstable set
// (Murray 2003, Mathematical Biology II, ch. 2: f_u + g_v < 0, det J > 0, d f_u + g_v > 0, (d f_u + g_v)² > 4 d det J).
const a = 0.1,
  b = 0.9,
  du = 1,
  dv = 10;
const [us, vs] = schnakenbergSteadyState(a, b);
// Jacobian at (u*, v*) in closed form: f_u = (b − a)/(a + b), f_v = (a + b)², g_u = −2b/(a + b), g_v = −(a + b)².
const fu = (b - a) / (a + b),
  fv = (a + b) ** 2,
  gu = (-2 * b) / (a + b),
  gv = -((a + b) ** 2);

/** Leading σ(k) of J − k²D and its eigenvector, 2×2 closed form (SCIENCE.md §1). */
function leadingMode(k2: number): { sigma: number; vec: [number, number] } {
  const tr = fu + gv - k2 * (du + dv);
  const det = (fu - k2 * du) * (gv - k2 * dv) - fv * gu;
  const disc = (tr * tr) / 4 - det;
  if (disc < 0) throw new Error("complex pair; pick a real mode");
  const sigma = tr / 2 + Math.sqrt(disc);
  // First row of (J − k²D − σ)v = 0.
  return { sigma, vec: [fv, sigma - fu + k2 * du] };
}

interface GrowthCase {
  label: string;
  cells: number[];
  lengthUm: number[];
  modes: number[];
  endTimeS: number;
  dtS: number;
  scheme: SchemeName;
}

const L = 10 * Math.PI;
const cases: GrowthCase[] = [
  { label: "1-D n = 6 (growing)", cells: [64], lengthUm: [L], modes: [6], endTimeS: 60, dtS: 0.05, scheme: "etd2" },
  { label: "1-D n = 12 (decaying)", cells: [64], lengthUm: [L], modes: [12], endTimeS: 8, dtS: 0.02, scheme: "etd2" },
  {
    label: "2-D (4, 4) (growing)",
    cells: [32, 32],
    lengthUm: [L, L],
    modes: [4, 4],
    endTimeS: 50,
    dtS: 0.05,
    scheme: "etd2",
  },
  // The integrating factor also exponentiates −k²D on the reaction term, so its error constant is
  // large (2.4 % at Δt = 0.0025 here, halving with Δt): it needs a smaller step for 1 %.
  {
    label: "1-D n = 6, integrating factor",
    cells: [64],
    lengthUm: [L],
    modes: [6],
    endTimeS: 30,
    dtS: 0.001,
    scheme: "integrating-factor",
  },
  {
    label: "1-D n = 6, implicit Euler",
    cells: [64],
    lengthUm: [L],
    modes: [6],
    endTimeS: 40,
    dtS: 0.005,
    scheme: "implicit-euler",
  },
];

describe("a small perturbation along one admissible mode grows at σ(k)", () => {
  it.each(cases)("$label: measured growth rate within 1 % of σ(k)", (c) => {
    const nx = c.cells[0],
      ny = c.cells[1] ?? 1;
    const phi = new Float64Array(nx * ny);
    let k2 = 0;
    for (let iy = 0; iy < ny; iy++)
      for (let ix = 0; ix < nx; ix++) {
        let p = Math.cos((c.modes[0] * Math.PI * (ix + 0.5)) / nx);
        if (ny > 1) p *= Math.cos((c.modes[1] * Math.PI * (iy + 0.5)) / ny);
        phi[iy * nx + ix] = p;
      }
    c.modes.forEach((m, i) => (k2 += ((m * Math.PI) / c.lengthUm[i]) ** 2));
    const { sigma, vec } = leadingMode(k2);
    const eps = 1e-6 / Math.hypot(vec[0], vec[1]);
    const u0 = phi.map((p) => us + eps * vec[0] * p),
      v0 = phi.map((p) => vs + eps * vec[1] * p);
    const r = simulateReactionDiffusion(schnakenbergReaction, {
      grid: { lengthUm: c.lengthUm, cells: c.cells },
      diffusionUm2PerS: [du, dv],
      params: { a, b, gamma: 1 },
      initial: { kind: "fields", fields: [u0, v0] },
      endTimeS: c.endTimeS,
      dtS: c.dtS,
      scheme: c.scheme,
    });
    const project = (f: Float64Array, base: number) => {
      let num = 0,
        den = 0;
      for (let i = 0; i < f.length; i++) {
        num += (f[i] - base) * phi[i];
        den += phi[i] * phi[i];
      }
      return num / den;
    };
    const growth = Math.log(project(r.fields[0], us) / project(u0, us)) / r.timeS;
    expect(Math.abs(growth / sigma - 1)).toBeLessThan(0.01);
  });
});
