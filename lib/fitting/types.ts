/**
 * A least-squares problem in its natural parameters: `residuals(θ)` returns the already weighted
 * residuals rᵢ = (predictedᵢ − measuredᵢ)/sᵢ, so χ² = Σ rᵢ². A non-finite entry marks θ as
 * inadmissible (the solver then treats χ² as +∞ there).
 */
export interface LeastSquaresProblem {
  /** Number of residuals n. */
  residualCount: number;
  /** Number of parameters p. */
  parameterCount: number;
  /** Weighted residuals at θ (natural units), length n. */
  residuals(params: readonly number[]): Float64Array;
  /**
   * Optional analytic Jacobian ∂rᵢ/∂θⱼ at θ, as n rows of p entries. Without it the solver uses
   * central differences.
   */
  jacobian?(params: readonly number[]): number[][];
}

/** Why the local solver stopped. Only the first four count as convergence. */
export type SolverStopReason =
  | "relative-reduction"
  | "step-size"
  | "gradient"
  | "zero-residual"
  | "max-iterations"
  | "stalled"
  | "saturated"
  | "diverged"
  | "non-finite-start";

/** Stop reasons that mean a local minimum was reached. */
export const CONVERGED_REASONS: readonly SolverStopReason[] = [
  "relative-reduction",
  "step-size",
  "gradient",
  "zero-residual",
];

/** The outcome of one local optimisation (one start). */
export interface LocalSolution {
  /** Best parameters found, natural units. */
  params: number[];
  /** χ² = Σ rᵢ² at `params`. */
  chiSquare: number;
  /** True when the stop reason is one of {@link CONVERGED_REASONS}. */
  converged: boolean;
  reason: SolverStopReason;
  /** Iterations of the library stage (ml-levenberg-marquardt) and of the polishing stage. */
  iterations: { library: number; polish: number };
  /** Residual evaluations used. */
  evaluations: number;
  /** Indices of parameters that ended on a bound. */
  atBound: number[];
}
