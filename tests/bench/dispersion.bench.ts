/** One dispersion curve (steady state, 200-point σ(k), refined k*, bands, Turing conditions). */
import { compileKinetics, getCatalogueKinetics, type CompiledKinetics } from "@/lib/kinetics";
import { computeDispersion } from "@/lib/stability";
import type { BenchRow } from "./run";

function time(k: CompiledKinetics, runs: number, options = {}): number {
  for (let i = 0; i < 20; i++) computeDispersion(k, {}, options);
  const t = performance.now();
  for (let i = 0; i < runs; i++) computeDispersion(k, {}, options);
  return (performance.now() - t) / runs;
}

export default async function bench(): Promise<BenchRow[]> {
  const custom = compileKinetics({
    name: "Schnakenberg (expressions)",
    species: ["u", "v"],
    parameters: [
      { name: "a", default: 0.1 },
      { name: "b", default: 0.9 },
      { name: "d", default: 20 },
    ],
    reactions: ["a - u + u^2 v", "b - u^2 v"],
    diffusion: [1, "d"],
  });
  return [
    {
      name: "dispersion curve, Schnakenberg (catalogue)",
      value: time(getCatalogueKinetics("schnakenberg"), 500),
      unit: "ms",
      target: "< 5 ms",
    },
    {
      name: "dispersion curve + interval domain, Schnakenberg",
      value: time(getCatalogueKinetics("schnakenberg"), 500, { domain: { kind: "interval", length: 100 } }),
      unit: "ms",
      target: "< 5 ms",
    },
    {
      name: "dispersion curve, Schnakenberg (lab expressions, Newton)",
      value: time(custom, 200),
      unit: "ms",
      target: "< 5 ms",
    },
    {
      name: "dispersion curve, 3-species (ml-matrix eigen)",
      value: time(getCatalogueKinetics("brusselator-three-species"), 50),
      unit: "ms",
    },
  ];
}
