import { computeCovariance, type CovarianceReport } from "./covariance";
import { badOption } from "./errors";
import type { SolverContext } from "./fit-with-fixed";
import { assessIdentifiability, type Identifiability } from "./identifiability";
import { computeAicc, computeBic } from "./information-criteria";
import { computeJacobian } from "./jacobian";
import { createParameterSpace, toInternal, toNatural, typicalScale } from "./parameter-space";
import { DEFAULT_PROFILE, profileParameter, type ProfileLikelihood } from "./profile-likelihood";
import { internalFunctions, type LeastSquaresResult } from "./solve-least-squares";
import { traceValley, type Valley } from "./trace-valley";
import type { LeastSquaresProblem } from "./types";

export interface AnalysisOptions {
  /** Parameter names used in the plain-language reasons. @default ["θ1", "θ2", …] */
  names?: readonly string[];
  /** The sᵢ are absolute standard deviations; when false Cov is scaled by χ²/(n − p). @default true */
  absoluteUncertainties?: boolean;
  /**
   * Compute 95 % profile-likelihood intervals (costs re-optimisations). The threshold is
   * Δχ² = 3.84, times χ²/(n − p) when the uncertainties are not absolute. @default true
   */
  profiles?: boolean;
  /** Grid size of the valley traced for a non-identifiable fit (0 disables it). @default 21 */
  valleyPoints?: number;
}

/** Goodness of fit, uncertainty and identifiability of a least-squares solution. */
export interface FitAnalysis {
  /** Number of residuals n and of free parameters p. */
  n: number;
  p: number;
  chiSquare: number;
  /** χ²/(n − p); null when n ≤ p. */
  reducedChiSquare: number | null;
  residuals: number[];
  covariance: CovarianceReport;
  /** Per parameter; null when profiles were not asked for. */
  profiles: ProfileLikelihood[] | null;
  /** The Δχ² that defined the profile intervals (3.84, or 3.84·χ²/(n − p) for relative uncertainties). */
  profileDelta: number;
  aicc: number | null;
  bic: number;
  identifiability: Identifiability;
  /** The curve of equally good solutions, when the fit is not identifiable and p ≥ 2. */
  valley: Valley | null;
  /** Anything the numbers alone would hide (a better minimum met while profiling, a parameter on a bound). */
  warnings: string[];
}

/** Looser tolerances for the many re-optimisations inside profiles and valleys. */
const INNER_POLISH = {
  maxIterations: 100,
  relativeReduction: 1e-9,
  stepTolerance: 1e-7,
  gradientTolerance: 1e-7,
  initialDamping: 1e-3,
  divergenceFactor: 1e12,
};

/**
 * Statistics of a solved problem (SCIENCE.md §7): covariance (JᵀWJ)⁻¹ and standard errors,
 * χ² and reduced χ², AICc and BIC, 95 % profile-likelihood intervals, identifiability, and
 * for a non-identifiable fit the valley of equally good solutions.
 */
export function analyseFit(
  problem: LeastSquaresProblem,
  solution: LeastSquaresResult,
  options: AnalysisOptions = {},
): FitAnalysis {
  const p = problem.parameterCount;
  const n = problem.residualCount;
  const names = options.names ?? Array.from({ length: p }, (_, j) => `θ${j + 1}`);
  if (names.length !== p)
    throw badOption("names", `names must hold ${p} entries (one per parameter); got ${names.length}.`);
  const valleyPoints = options.valleyPoints ?? 21;
  if (!Number.isInteger(valleyPoints) || valleyPoints < 0 || (valleyPoints > 0 && valleyPoints < 3))
    throw badOption("valleyPoints", `valleyPoints must be 0 or an integer of at least 3; got ${valleyPoints}.`);
  const { lower, upper, log } = solution.options;
  const space = createParameterSpace(lower, upper, log);
  const uHat = toInternal(space, solution.params);
  const typical = typicalScale(space, toInternal(space, solution.options.start));
  const { f, jacobian } = internalFunctions(problem, space);
  const ctx: SolverContext = { f, space, typical, polish: INNER_POLISH, jacobian };
  const Ju = (jacobian ?? ((u, r) => computeJacobian(f, u, r, space, typical)))(uHat, solution.residuals).jacobian;
  const Jtheta = Ju.clone();
  for (let j = 0; j < p; j++)
    if (log[j]) for (let i = 0; i < n; i++) Jtheta.set(i, j, Ju.get(i, j) / solution.params[j]);
  const typicalNatural = typical.map((t, j) => (log[j] ? Math.abs(solution.params[j]) : t));
  const covariance = computeCovariance(
    Jtheta,
    solution.params,
    typicalNatural,
    solution.chiSquare,
    options.absoluteUncertainties ?? true,
  );
  const warnings: string[] = [];
  // With relative uncertainties the likelihood is in units of χ²/s², s² = χ²/(n − p), so the
  // interval threshold scales the same way as the covariance.
  const absolute = options.absoluteUncertainties ?? true;
  const delta = DEFAULT_PROFILE.delta * (absolute || !Number.isFinite(covariance.scale) ? 1 : covariance.scale);
  const profileOptions = { ...DEFAULT_PROFILE, delta };
  const natural = (u: number[]) => toNatural(space, u);
  let profiles: ProfileLikelihood[] | null = null;
  if (options.profiles ?? true) {
    profiles = names.map((_, j) => {
      const se = covariance.standardErrors[j];
      const seU = se === null ? null : log[j] ? se / solution.params[j] : se;
      const firstStep = seU !== null && seU > 0 && Number.isFinite(seU) ? seU : 0.1 * typical[j];
      return profileParameter(ctx, uHat, solution.chiSquare, j, firstStep, natural, profileOptions);
    });
    profiles.forEach((prof, j) => {
      if (prof.lowerChiSquareFound !== null)
        warnings.push(
          `While profiling ${names[j]} a lower χ² (${prof.lowerChiSquareFound.toPrecision(6)}) than the fit's (${solution.chiSquare.toPrecision(6)}) was found: the fit is a local minimum; try more starts.`,
        );
    });
  }
  for (const j of solution.atBound)
    warnings.push(`${names[j]} ended on its bound (${solution.params[j]}); its standard error ignores the bound.`);
  const identifiability = assessIdentifiability(n, names, covariance, profiles, delta);
  let valley: Valley | null = null;
  if (!identifiability.identifiable && p >= 2 && valleyPoints > 0) {
    const j = pickValleyParameter(identifiability, covariance);
    const range = valleyRange(space.lowerU[j], space.upperU[j], uHat[j], typical[j], profiles?.[j], space.log[j]);
    valley = traceValley(ctx, uHat, solution.chiSquare, j, range[0], range[1], valleyPoints, delta, natural);
  }
  return {
    n,
    p,
    chiSquare: solution.chiSquare,
    reducedChiSquare: n > p ? solution.chiSquare / (n - p) : null,
    residuals: Array.from(solution.residuals),
    covariance,
    profiles,
    profileDelta: delta,
    aicc: computeAicc(solution.chiSquare, n, p),
    bic: computeBic(solution.chiSquare, n, p),
    identifiability,
    valley,
    warnings,
  };
}

/** Step along a flat parameter if there is one, else the one that dominates the null direction. */
function pickValleyParameter(id: Identifiability, cov: CovarianceReport): number {
  if (id.flatParameters.length > 0) return id.flatParameters[0];
  const dir = cov.nullDirections[0];
  if (!dir) return 0;
  return dir.reduce((best, c, j) => (Math.abs(c) > Math.abs(dir[best]) ? j : best), 0);
}

/** The box where it is finite; otherwise the range the profile explored (or ±10 typical magnitudes). */
function valleyRange(
  lo: number,
  hi: number,
  u: number,
  typ: number,
  prof: ProfileLikelihood | undefined,
  log: boolean,
): [number, number] {
  if (Number.isFinite(lo) && Number.isFinite(hi)) return [lo, hi];
  const spread = 10 * typ;
  let a = Number.isFinite(lo) ? lo : u - spread;
  let b = Number.isFinite(hi) ? hi : u + spread;
  if (prof && prof.points.length > 1) {
    const values = prof.points.map((pt) => (log ? Math.log(pt.value) : pt.value));
    if (!Number.isFinite(lo)) a = Math.min(...values);
    if (!Number.isFinite(hi)) b = Math.max(...values);
  }
  return [a, b];
}
