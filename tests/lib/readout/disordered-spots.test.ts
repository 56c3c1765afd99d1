/**
 * Spots from a reaction–diffusion field: a disordered hexagonal packing, whose Fourier ring is nearly
 * uniform. The readout looks at the spots themselves (lib/readout/spot-order.ts) and calls it spots with a
 * nearest-neighbour spacing; a labyrinth stays a labyrinth. Fields simulated here from noise:
 * Schnakenberg (quadratic nonlinearity → spots) and FitzHugh–Nagumo (odd nonlinearity → stripes and
 * labyrinths) (Ermentrout 1991, Proc. R. Soc. A 434:413; Cross & Hohenberg 1993, Rev. Mod. Phys. 65:851 §VI).
 */
import { describe, expect, it } from "vitest";
import { getCatalogueKinetics, resolveParameters } from "@/lib/kinetics";
import { readWavelength } from "@/lib/readout";
import {
  createReactionSystemFromKinetics,
  readKineticsDiffusion,
  readKineticsSteadyState,
  simulateReactionDiffusion,
} from "@/lib/simulation";

function simulateField(id: string, values: Record<string, number>, endTimeS: number, seed: number) {
  const k = getCatalogueKinetics(id);
  const p = resolveParameters(k, values);
  const N = 128,
    L = 160;
  const r = simulateReactionDiffusion(createReactionSystemFromKinetics(k), {
    grid: { lengthUm: [L, L], cells: [N, N] },
    diffusionUm2PerS: readKineticsDiffusion(k, p),
    params: Object.fromEntries(k.parameters.map((s, i) => [s.name, p[i]])),
    initial: { kind: "steady-state-noise", steadyState: readKineticsSteadyState(k, p)!, noiseAmplitude: 0.01, seed },
    endTimeS,
    stiffnessSafety: 0.25,
  });
  const u = r.fields[0];
  let min = Infinity,
    max = -Infinity;
  for (const v of u) [min, max] = [Math.min(min, v), Math.max(max, v)];
  return {
    image: { width: N, height: N, data: Float32Array.from(u, (v) => (v - min) / (max - min)) },
    pixelSizeUm: L / N,
  };
}

describe("spots in a disordered hexagonal packing", () => {
  it("a Schnakenberg field the harmonics call labyrinth is called spots, with a nearest-neighbour spacing", () => {
    // Seed 2 gives a polycrystalline field whose angular harmonics are below the hexagonal threshold.
    const { image, pixelSizeUm } = simulateField("schnakenberg", { gamma: 1, a: 0.1, b: 0.9, d: 20 }, 300, 2);
    const r = readWavelength(image, { pixelSizeUm });
    expect(r.symmetry).toBe("hexagonal");
    expect(r.symmetrySource).toBe("spots");
    expect(r.spotOrder!.psi6Local).toBeGreaterThan(0.55);
    // As many spots as a hexagonal packing at this wavelength holds: ρ = 2/(√3·a²), a = (2/√3)·λ
    // (SCIENCE.md §4); within 10 % (common practice, no source).
    const a = (2 / Math.sqrt(3)) * r.wavelengthUm!;
    const areaUm2 = 160 * 160;
    expect(r.spotOrder!.count).toBeWithinRelative((2 / (Math.sqrt(3) * a * a)) * areaUm2, 0.1);
    // The mean nearest-neighbour distance lies between a random pattern's, 0.5/√ρ, and a perfect
    // hexagonal lattice's, 2.149 × that (Clark & Evans 1954, Ecology 35:445).
    const randomNnUm = 0.5 / Math.sqrt(r.spotOrder!.count / areaUm2);
    expect(r.nearestNeighbourUm!).toBeGreaterThan(randomNnUm);
    expect(r.nearestNeighbourUm!).toBeLessThanOrEqual(2.149 * randomNnUm);
    expect(r.nearestNeighbourUm).toBe(r.spotOrder!.nearestNeighbourMeanUm);
    expect(r.nearestNeighbourUncertaintyUm!).toBeGreaterThan(0);
  });

  it("a FitzHugh–Nagumo labyrinth stays a labyrinth (its maxima lie on ridges, not round)", () => {
    const { image, pixelSizeUm } = simulateField("fitzhugh-nagumo", { gamma: 1, eps: 3, a: 0, b: 0.5, d: 20 }, 100, 1);
    const r = readWavelength(image, { pixelSizeUm });
    expect(r.symmetry).toBe("labyrinth");
    expect(r.nearestNeighbourUm).toBeNull();
    expect(r.spotOrder!.roundness).toBeLessThan(0.6);
  });
});
