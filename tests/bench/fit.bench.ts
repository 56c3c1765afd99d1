/** Fitting speed with the real stability engine: one 3-parameter, 4-condition fit, and a 6-kinetics comparison. */
import { compareFits, fitWavelengths, type ParameterSetting, type WavelengthFitResult } from "@/lib/fitting";
import { createKineticsPredictor } from "@/lib/fitting/kinetics-predictor";
import { getCatalogueKinetics } from "@/lib/kinetics";
import type { BenchRow } from "./run";

const B: Record<string, number> = { c0: 0.9, c1: 1.0, c2: 1.1, c3: 1.2 };

export default async function bench(): Promise<BenchRow[]> {
  const schnak = createKineticsPredictor(getCatalogueKinetics("schnakenberg"), { lengthScaleUm: 10 });
  const data = Object.keys(B).map((c) => ({
    condition: c,
    wavelengthUm: schnak({ gamma: 1, a: 0.1, d: 20, b: B[c] }, c, undefined)!.wavelengthUm * 1.01,
    uncertaintyUm: 1,
    kind: "fourier" as const,
  }));
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
  // A 6-kinetics comparison on the same data: each catalogue kinetics frees its scale parameter
  // per condition (γ, or a for the Brusselator), other parameters at their catalogue defaults.
  t = performance.now();
  const fits: { label: string; result: WavelengthFitResult }[] = [];
  const compareData = data.slice(0, 2);
  for (const [id, name, lower, upper, start] of [
    ["schnakenberg", "gamma", 0.01, 100, 1],
    ["gierer-meinhardt", "gamma", 0.01, 100, 1],
    ["gierer-meinhardt-saturation", "gamma", 0.01, 100, 1],
    ["fitzhugh-nagumo", "gamma", 0.01, 100, 1],
    ["thomas", "gamma", 0.01, 100, 1],
    ["brusselator", "a", 0.5, 3, 1.5],
  ] as const) {
    const pred = createKineticsPredictor(getCatalogueKinetics(id), { lengthScaleUm: 10 });
    try {
      fits.push({
        label: id,
        result: fitWavelengths(
          {
            data: compareData,
            parameters: {
              [name]: { mode: "per-condition", start, lower, upper, log: name === "gamma" } as ParameterSetting,
            },
            options: { profiles: false },
          },
          pred,
        ),
      });
    } catch {
      // A kinetics whose box has no Turing region is reported by the app before any job; here it just drops out.
    }
  }
  compareFits(fits);
  const comparison = performance.now() - t;
  const compared = fits.length;
  // One prediction: the fast fastest-mode path against the full dispersion relation (same numbers).
  const general = createKineticsPredictor(getCatalogueKinetics("schnakenberg"), { lengthScaleUm: 10, fastPath: false });
  const perCall = (pred: typeof schnak, calls: number) => {
    const t0 = performance.now();
    for (let i = 0; i < calls; i++) pred({ gamma: 1 + (i % 97) * 1e-3, a: 0.1, d: 20, b: 1 }, "c1", undefined);
    return ((performance.now() - t0) / calls) * 1000;
  };
  return [
    { name: "fit: 3 free parameters, 4 conditions, with profiles", value: single, unit: "ms", target: "≤ 500 ms" },
    { name: "fit: 3 free parameters, 4 conditions, no profiles", value: singleNoProfiles, unit: "ms" },
    {
      name: "compare: 6 catalogue kinetics (scale parameter free per condition)",
      value: comparison,
      unit: "ms",
      target: "< 5000 ms",
      note: `${compared} of 6 kinetics fitted`,
    },
    { name: "predictor: one call, fast path (2 species, diagonal D)", value: perCall(schnak, 20000), unit: "µs" },
    { name: "predictor: one call, general path (computeDispersion)", value: perCall(general, 2000), unit: "µs" },
  ];
}
