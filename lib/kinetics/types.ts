/** Core types shared by the kinetics catalogue, the custom-expression compiler and the stability code. */

/** One named parameter of a kinetics, with its allowed closed range. */
export interface ParameterSpec {
  /** Symbol used in the expressions, e.g. `a`, `gamma`, `Du`. */
  name: string;
  /** What it means, one short phrase. */
  meaning: string;
  /** Value used when the caller does not set it. */
  default: number;
  /** Smallest allowed value (inclusive). */
  min: number;
  /** Largest allowed value (inclusive). */
  max: number;
  /** Unit when the model is dimensional, e.g. `µm²/s`; `1` for non-dimensional. */
  unit?: string;
}

/**
 * Whether rates and diffusivities are in physical units (D µm²/s, rates 1/s, so k is 1/µm)
 * or non-dimensional (then a length scale ℓ µm and a time scale τ s turn results physical).
 */
export type KineticsUnits = "dimensional" | "non-dimensional";

/**
 * A ready-to-evaluate kinetics: n species, parameter vector `p` in the order of `parameters`.
 * All evaluators write into caller-owned buffers so inner loops allocate nothing.
 */
export interface CompiledKinetics {
  /** Stable kebab-case id for catalogue entries; `custom` (or the definition's id) otherwise. */
  id: string;
  name: string;
  /** Published source of the kinetics (catalogue), or free text. */
  source: string;
  species: readonly string[];
  parameters: readonly ParameterSpec[];
  units: KineticsUnits;
  /** Reaction terms R_i(c; p) as mathjs expression strings (same order as `species`). */
  reactionExpressions: readonly string[];
  /** Diffusion matrix entries as expression strings, n×n row-major (zeros off-diagonal when diagonal). */
  diffusionExpressions: readonly (readonly string[])[];
  /** True when the species are concentrations: only steady states with every c_i ≥ 0 are reported. */
  nonNegative: boolean;
  /** True when the diffusion matrix is diagonal for every parameter value. */
  diagonalDiffusion: boolean;
  /** R(c; p) → out (length n). */
  rates(c: ArrayLike<number>, p: ArrayLike<number>, out: Float64Array): void;
  /** ∂R_i/∂c_j → out[i·n + j] (row-major n×n). */
  jacobian(c: ArrayLike<number>, p: ArrayLike<number>, out: Float64Array): void;
  /** D(p) → out[i·n + j] (row-major n×n). */
  diffusion(p: ArrayLike<number>, out: Float64Array): void;
  /**
   * Closed-form homogeneous steady states, when known: writes up to `out.length / n` states
   * (state s at out[s·n …]) and returns how many were written (0 = none exists here).
   */
  steadyStates?(p: ArrayLike<number>, out: Float64Array): number;
  /** How the Jacobian is computed: hand-written, mathjs symbolic, or partly numerical. */
  jacobianMethod: "analytic" | "symbolic" | "symbolic+numeric";
}

/** Physical scales of a non-dimensional model (SCIENCE.md §3). */
export interface PhysicalScales {
  /** ℓ: one model length unit in µm. */
  lengthScaleUm?: number;
  /** τ: one model time unit in s. */
  timeScaleS?: number;
}
