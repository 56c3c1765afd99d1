/** Fitting speed with the real stability engine: one 3-parameter, 4-condition fit, and a 6-kinetics comparison. */
import { compareFits, fitWavelengths, type ParameterSetting, type WavelengthFitResult } from "@/lib/fitting";
import { createKineticsPredictor } from "@/lib/fitting/kinetics-predictor";
import { getCatalogueKinetics } from "@/lib/kinetics";
import type { BenchRow } from "./run";

const B: Record<string, number> = { c0: 0.9, c1: 1.0, c2: 1.1, c3: 1.2 };

export default async function bench(): Promise<BenchRow[]> {
  const schnak = createKineticsPredictor(getCatalogueKinetics("schnakenberg"), { lengthScaleUm: 10 });
  const data = Object.keys(B).map((c) => ({ condition: c, wavelengthUm: schnak({ gamma: 1, a: 0.1, d: 20, b: B[c] }, c, undefined)!.wavelengthUm * 1.01, uncertaintyUm: 1, kind: "fourier" as const }));
  const three: Record<string, ParameterSetting> = {
    gamma: { mode: "free", start: 2, lower: 0.1, upper: 10, log: true },
    a: { mode: "free", start: 0.2, lower: 0.01, upper: 0.5 },
    d: { mode: "free", start: 30, lower: 5, upper: 200, log: true },
    b: { mode: "fixed", value: B },
  };
  let t = performance.now();
  fitWavelengths({ data, parameters: three }, schnak);
  const single = performance.now() - t;
  t = performance.now();
  fitWavelengths({ data, parameters: three, options: { profiles: false } }, schnak);
  const singleNoProfiles = performance.now() - t;
  // Six fits of the same data (two parameters each, no profiles): the comparison workload.
  t = performance.now();
  const fits: { label: string; result: WavelengthFitResult }[] = [];
  for (const [k, d] of [[1, 20], [0.8, 15], [1.2, 25], [1, 40], [0.5, 20], [2, 20]]) {
    const pred = createKineticsPredictor(getCatalogueKinetics("schnakenberg"), { lengthScaleUm: 10 * k });
    fits.push({
      label: `schnakenberg ℓ=${10 * k} d0=${d}`,
      result: fitWavelengths({ data, parameters: { ...three, a: { mode: "fixed", value: 0.1 }, d: { ...(three.d as object), start: d } as ParameterSetting }, options: { profiles: false } }, pred),
    });
  }
  compareFits(fits);
  const comparison = performance.now() - t;
  // One prediction: the fast fastest-mode path against the full dispersion relation (same numbers).
  const general = createKineticsPredictor(getCatalogueKinetics("schnakenberg"), { lengthScaleUm: 10, fastPath: false });
  const perCall = (pred: typeof schnak, calls: number) => {
    const t0 = performance.now();
    for (let i = 0; i < calls; i++) pred({ gamma: 1 + (i % 97) * 1e-3, a: 0.1, d: 20, b: 1 }, "c1", undefined);
    return ((performance.now() - t0) / calls) * 1000;
  };
  return [
    { name: "fit: 3 free parameters, 4 conditions, with profiles", value: single, unit: "ms", target: "< 1000 ms" },
    { name: "fit: 3 free parameters, 4 conditions, no profiles", value: singleNoProfiles, unit: "ms" },
    { name: "compare: 6 fits (2 free parameters each, no profiles)", value: comparison, unit: "ms", target: "< 5000 ms", note: "schnakenberg at six length scales; the catalogue's other kinetics need their own specs" },
    { name: "predictor: one call, fast path (2 species, diagonal D)", value: perCall(schnak, 20000), unit: "µs" },
    { name: "predictor: one call, general path (computeDispersion)", value: perCall(general, 2000), unit: "µs" },
  ];
}
