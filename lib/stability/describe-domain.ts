/** Fastest-growing admissible mode of a bounded domain and how many repeats it lays down (SCIENCE.md §2). */
import type { StateAnalysis } from "./analyse-state";
import { sigmaAt } from "./dispersion-scan";
import { describeRepeats, enumerateModes, toModelDomain, type DomainSpec } from "./domains";
import { growthRatePerS, wavelengthUm, wavenumberPerUm, type ResolvedScales } from "./scales";

export interface ModeGrowth {
  indices: number[];
  k: number;
  kPerUm: number | null;
  multiplicity: number;
  sigma: number;
  imSigma: number;
  growthRatePerS: number | null;
  wavelength: number;
  wavelengthUm: number | null;
}

export interface DomainResult {
  /** The domain in model units. */
  domain: DomainSpec;
  /** Fastest admissible mode (largest Re σ), growing or not. */
  fastestMode: ModeGrowth & { repeats: Record<string, number> };
  /** True when the fastest admissible mode grows (σ > 0). */
  patterningExpected: boolean;
  /** Admissible modes with σ > 0. */
  unstableModeCount: number;
  /** The five fastest admissible modes. */
  topModes: ModeGrowth[];
}

/** How many of the fastest modes are listed. */
const TOP_MODES = 5;

export function describeDomain(a: StateAnalysis, spec: DomainSpec, scales: ResolvedScales): DomainResult {
  const domain = toModelDomain(spec, scales.lengthScaleUm);
  const modes = enumerateModes(domain, a.kMax).map((m): ModeGrowth => {
    const sigma = sigmaAt(a.ws, m.k);
    return {
      indices: m.indices,
      k: m.k,
      kPerUm: wavenumberPerUm(m.k, scales),
      multiplicity: m.multiplicity,
      sigma,
      imSigma: a.ws.eig[1],
      growthRatePerS: growthRatePerS(sigma, scales),
      wavelength: (2 * Math.PI) / m.k,
      wavelengthUm: wavelengthUm(m.k, scales),
    };
  });
  modes.sort((x, y) => y.sigma - x.sigma || x.k - y.k);
  const best = modes[0];
  return {
    domain,
    fastestMode: { ...best, repeats: describeRepeats(domain, best) },
    patterningExpected: best.sigma > a.tol,
    unstableModeCount: modes.filter((m) => m.sigma > a.tol).length,
    topModes: modes.slice(0, TOP_MODES),
  };
}
