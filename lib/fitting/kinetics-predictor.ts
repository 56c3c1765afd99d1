import type { CompiledKinetics } from "../kinetics";
import { resolveParameters } from "../kinetics/parameters";
import { computeDispersion, isTuring, resolveScales, type DomainSpec } from "../stability";
import { computeFastestMode, createFastestModeWorkspace, type FastestMode } from "../stability/fastest-mode";
import type { WavelengthPrediction, WavelengthPredictor } from "./wavelength-spec";

/** Parameter names the predictor reads as physical scales rather than kinetics parameters. */
export const SCALE_PARAMETERS = ["lengthScaleUm", "timeScaleS"] as const;

export interface KineticsPredictorOptions {
  /** ℓ, µm per model length unit, unless given (or fitted) as the parameter `lengthScaleUm`. */
  lengthScaleUm?: number;
  /** τ, s per model time unit. */
  timeScaleS?: number;
  /** k-grid size of the dispersion scan. @default 200 */
  gridSize?: number;
  /**
   * For two species with diagonal D on an unbounded domain, compute only the fastest mode
   * (lib/stability/fastest-mode: the same arithmetic as computeDispersion, so the same numbers)
   * instead of the full dispersion relation. `false` forces computeDispersion. @default true
   */
  fastPath?: boolean;
}

/**
 * The wavelength predictor of a kinetics from the stability engine: 2π/k* of the fastest-growing
 * mode in µm (on a bounded domain, of the fastest admissible mode). `turing` means the state is
 * stable at k = 0 and grows only by a real Turing mode (a Turing state that is also Hopf-unstable
 * does not count: it would oscillate). Parameters named `lengthScaleUm`/`timeScaleS` set the scales,
 * so a non-dimensional model can fit its length scale. No length scale → no prediction in µm (null).
 * Two-species kinetics with diagonal D on an unbounded domain take the closed-form fast path
 * (about 100× cheaper); anything it cannot settle (other kinetics, finite domains, irregular
 * points) goes through `computeDispersion`, which also raises the errors.
 */
export function createKineticsPredictor(
  kinetics: CompiledKinetics,
  options: KineticsPredictorOptions = {},
): WavelengthPredictor<DomainSpec> {
  const gridSize = options.gridSize ?? 200;
  const fastKinetics =
    (options.fastPath ?? true) &&
    kinetics.species.length === 2 &&
    kinetics.diagonalDiffusion &&
    Number.isInteger(gridSize) &&
    gridSize >= 16 &&
    gridSize <= 100_000;
  const ws = fastKinetics ? createFastestModeWorkspace(gridSize) : undefined;
  return (params, _condition, domain) => {
    const kineticsParams: Record<string, number> = {};
    for (const [name, v] of Object.entries(params))
      if (!(SCALE_PARAMETERS as readonly string[]).includes(name)) kineticsParams[name] = v;
    const lengthScaleUm = params.lengthScaleUm ?? options.lengthScaleUm;
    const timeScaleS = params.timeScaleS ?? options.timeScaleS;
    if (fastKinetics && !domain) {
      // Same validation, in the same order, as computeDispersion (after its grid check, passed above).
      const p = resolveParameters(kinetics, kineticsParams);
      const scales = resolveScales(kinetics, { lengthScaleUm, timeScaleS });
      const m = computeFastestMode(kinetics, p, gridSize, ws);
      if (m) return fastPrediction(m, scales.lengthScaleUm);
    }
    const r = computeDispersion(kinetics, kineticsParams, {
      lengthScaleUm,
      timeScaleS,
      gridSize: options.gridSize,
      domain,
    });
    const flags = r.classification.flags;
    const turing = isTuring(flags);
    if (domain && r.domain) {
      const m = r.domain.fastestMode;
      if (m.wavelengthUm === null) return null;
      return { wavelengthUm: m.wavelengthUm, turing: turing && r.domain.patterningExpected && m.imSigma === 0 };
    }
    const f = r.fastest;
    if (!f || f.wavelengthUm === null) return null;
    return { wavelengthUm: f.wavelengthUm, turing: turing && f.kind === "turing" };
  };
}

/** The general path's answer from the fast path's numbers (wavelength as in stability/scales: 2πℓ/k). */
function fastPrediction(m: FastestMode, lengthScaleUm: number | null): WavelengthPrediction | null {
  if (!(m.kStar > 0) || lengthScaleUm === null) return null;
  const turing = isTuring(m.flags);
  return { wavelengthUm: (2 * Math.PI * lengthScaleUm) / m.kStar, turing: turing && m.kind === "turing" };
}
