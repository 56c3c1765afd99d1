import type { CompiledKinetics } from "../kinetics";
import { CLASS_HOPF, CLASS_INVALID, CLASS_NO_STEADY_STATE, CLASS_TURING, CLASS_UNSTABLE_K0, computeDispersion, type DomainSpec } from "../stability";
import type { WavelengthPredictor } from "./wavelength-spec";

/** Parameter names the predictor reads as physical scales rather than kinetics parameters. */
export const SCALE_PARAMETERS = ["lengthScaleUm", "timeScaleS"] as const;

export interface KineticsPredictorOptions {
  /** ℓ, µm per model length unit, unless given (or fitted) as the parameter `lengthScaleUm`. */
  lengthScaleUm?: number;
  /** τ, s per model time unit. */
  timeScaleS?: number;
  /** k-grid size of the dispersion scan. @default 200 */
  gridSize?: number;
}

/**
 * The wavelength predictor of a kinetics from the stability engine: 2π/k* of the fastest-growing
 * mode in µm (on a bounded domain, of the fastest admissible mode). `turing` means the state is
 * stable at k = 0 and grows only by a real Turing mode (a Turing state that is also Hopf-unstable
 * does not count: it would oscillate). Parameters named `lengthScaleUm`/`timeScaleS` set the scales,
 * so a non-dimensional model can fit its length scale. No length scale → no prediction in µm (null).
 */
export function createKineticsPredictor(kinetics: CompiledKinetics, options: KineticsPredictorOptions = {}): WavelengthPredictor<DomainSpec> {
  return (params, _condition, domain) => {
    const kineticsParams: Record<string, number> = {};
    for (const [name, v] of Object.entries(params)) if (!(SCALE_PARAMETERS as readonly string[]).includes(name)) kineticsParams[name] = v;
    const lengthScaleUm = params.lengthScaleUm ?? options.lengthScaleUm;
    const timeScaleS = params.timeScaleS ?? options.timeScaleS;
    const r = computeDispersion(kinetics, kineticsParams, { lengthScaleUm, timeScaleS, gridSize: options.gridSize, domain });
    const flags = r.classification.flags;
    const turing = (flags & CLASS_TURING) !== 0 && (flags & (CLASS_HOPF | CLASS_UNSTABLE_K0 | CLASS_NO_STEADY_STATE | CLASS_INVALID)) === 0;
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
