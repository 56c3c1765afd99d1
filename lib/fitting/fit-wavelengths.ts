import { analyseFit } from "./analyse-fit";
import { resolveWavelengthSpec, type ResolvedWavelengthSpec } from "./resolve-wavelength-spec";
import { FitError } from "./errors";
import { sampleTuringBox, type BoxSample } from "./sample-turing-box";
import { solveLeastSquares } from "./solve-least-squares";
import { createWavelengthModel } from "./wavelength-model";
import type { FittedDatum, FittedParameter, IntervalSide, WavelengthFitResult } from "./wavelength-result";
import type { WavelengthFitSpec, WavelengthPredictor } from "./wavelength-spec";
import { judgeFit } from "./judge-wavelength-fit";
import type { ProfileLikelihood, ProfileSide } from "./profile-likelihood";

const MAX_RESTARTS = 3;

/** Parameters of the lowest-χ² profile point below the fit's minimum, if any. */
function bestProfilePoint(profiles: readonly ProfileLikelihood[] | null): number[] | null {
  let best: { d: number; params: number[] } | null = null;
  for (const prof of profiles ?? []) {
    if (prof.lowerChiSquareFound === null) continue;
    for (const pt of prof.points)
      if (pt.deltaChiSquare < (best?.d ?? 0)) best = { d: pt.deltaChiSquare, params: pt.params };
  }
  return best?.params ?? null;
}

/** Distance in the unit box (log-scaled coordinates on the log scale). */
function boxDistance<T>(spec: ResolvedWavelengthSpec<T>, a: readonly number[], b: readonly number[]): number {
  return Math.hypot(
    ...spec.slots.map((s, j) =>
      s.log
        ? (Math.log(a[j]) - Math.log(b[j])) / (Math.log(s.upper) - Math.log(s.lower))
        : (a[j] - b[j]) / (s.upper - s.lower),
    ),
  );
}

function side(s: ProfileSide): IntervalSide {
  return { value: s.limit, open: s.openReason, turingEdge: s.edge };
}

/** Short FNV-1a hash of the measurements, for checking that compared fits used the same data. */
function fingerprint(spec: WavelengthFitSpec<unknown>): string {
  const text = JSON.stringify(
    spec.data.map((d) => [d.condition, d.wavelengthUm, d.uncertaintyUm, d.kind, d.domain ?? null]),
  );
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193) >>> 0;
  return `${spec.data.length}:${h.toString(16).padStart(8, "0")}`;
}

/**
 * Fit a model's predicted Fourier wavelength 2π/k* to measured wavelengths (SCIENCE.md §4, §7).
 * Nearest-neighbour spacings are first converted to Fourier wavelengths, λ = (√3/2)·a (hexagonal
 * spots). Only Turing-unstable states count as predictions: a step into a non-Turing state has
 * χ² = ∞ and is rejected, which steers the search back into the Turing region. Starts: the given
 * one (moved to the nearest Turing point of a seeded box sample when it lies outside the region)
 * and the best Turing points of that sample. Returns parameters with standard errors and profile
 * intervals, goodness of fit, identifiability and a verdict.
 * @throws FitError for invalid specs and when no sampled point of the box is Turing-unstable.
 */
export function fitWavelengths<TDomain>(
  spec: WavelengthFitSpec<TDomain>,
  predictor: WavelengthPredictor<TDomain>,
): WavelengthFitResult {
  const checked = resolveWavelengthSpec(spec);
  const { options, slots } = checked;
  const model = createWavelengthModel(checked, predictor);
  const samples = sampleTuringBox(slots, options.turingSamples, options.seed, model);
  const inside = samples.filter((s) => s.turing && Number.isFinite(s.chiSquareTuring));
  if (inside.length === 0) {
    throw new FitError(
      "no_turing_region",
      `No Turing region found within the parameter bounds: none of the ${samples.length} sampled points (the start and ${samples.length - 1} seeded points in the box) gives a Turing instability in every condition.`,
      "parameters",
    );
  }
  const notes: string[] = [];
  const warnings: string[] = [];
  const converted = checked.data.flatMap((d, i) => (d.kind === "nearest-neighbour" ? [`data[${i}]`] : []));
  if (converted.length > 0)
    notes.push(
      `Nearest-neighbour spacings (${converted.join(", ")}) were converted to Fourier wavelengths as λ = (√3/2)·a, which holds for spots on a hexagonal lattice; their uncertainties were scaled by the same factor.`,
    );
  let start = samples[0].free;
  if (!samples[0].turing) {
    const nearest = inside.reduce((a, b) =>
      boxDistance(checked, b.free, start) < boxDistance(checked, a.free, start) ? b : a,
    );
    notes.push(
      `The given start is outside the Turing region; the fit started from the nearest Turing point of the box sample instead.`,
    );
    start = nearest.free;
  }
  const byChi = (key: keyof Pick<BoxSample, "chiSquareTuring" | "chiSquareAny">) => (a: BoxSample, b: BoxSample) =>
    a[key] - b[key];
  const extra = inside
    .filter((s) => s.free !== start)
    .sort(byChi("chiSquareTuring"))
    .slice(0, options.seededStarts)
    .map((s) => s.free);
  const bounds = { lower: slots.map((s) => s.lower), upper: slots.map((s) => s.upper), log: slots.map((s) => s.log) };
  const problem = model.problem("turing");
  const names = slots.map((s) => s.label);
  const analysisOptions = {
    names,
    absoluteUncertainties: options.absoluteUncertainties,
    profiles: options.profiles,
    valleyPoints: options.valleyPoints,
  };
  let solution = solveLeastSquares(problem, { start, extraStarts: extra, ...bounds });
  let analysis = analyseFit(problem, solution, analysisOptions);
  // A step into a non-Turing state is rejected rather than projected, so a fit whose optimum lies
  // on the edge of the Turing region can stop at the first edge point it meets. The profiles then
  // find lower χ² along the edge: restart from the best point they found (a few rounds).
  for (let round = 0; round < MAX_RESTARTS; round++) {
    const better = bestProfilePoint(analysis.profiles);
    if (!better) break;
    const again = solveLeastSquares(problem, { start: better, extraStarts: [solution.params], ...bounds });
    if (!(again.chiSquare < solution.chiSquare)) break;
    notes.push(
      `The fit was restarted from a better point found while profiling (χ² ${again.chiSquare.toPrecision(6)} < ${solution.chiSquare.toPrecision(6)}).`,
    );
    solution = again;
    analysis = analyseFit(problem, solution, analysisOptions);
  }
  const predictions = model.predict(solution.params);
  const residuals: FittedDatum[] = checked.data.map((d, i) => {
    const p = predictions[i];
    return {
      index: i,
      condition: d.condition,
      kind: d.kind,
      measuredUm: d.wavelengthUm,
      measuredFourierUm: d.fourierUm,
      uncertaintyFourierUm: d.fourierUncertaintyUm,
      predictedUm: p ? p.wavelengthUm : null,
      turing: p?.turing ?? false,
      residual: p ? (p.wavelengthUm - d.fourierUm) / d.fourierUncertaintyUm : null,
    };
  });
  const record = (free: readonly number[]) => Object.fromEntries(names.map((n, j) => [n, free[j]]));
  const judged = judgeFit(checked, model, solution, residuals, samples, record);
  warnings.push(...analysis.warnings, ...judged.warnings);
  if (!solution.converged)
    warnings.push(`The solver did not converge (${solution.reason}); the numbers describe the best point it reached.`);
  const failures = model.failures();
  if (failures.count > 0)
    warnings.push(
      `The predictor failed ${failures.count} time(s), treated as "no prediction"; first error: ${failures.firstMessage}`,
    );
  const parameters: FittedParameter[] = slots.map((s, j) => {
    const prof = analysis.profiles?.[j];
    return {
      name: s.label,
      parameter: s.parameter,
      condition: s.condition,
      value: solution.params[j],
      standardError: analysis.covariance.standardErrors[j],
      interval95: prof ? { lower: side(prof.lower), upper: side(prof.upper) } : null,
      log: s.log,
      atBound: solution.atBound.includes(j),
    };
  });
  const fixed = Object.fromEntries(
    Object.entries(checked.settings).flatMap(([name, s]) => (s.mode === "fixed" ? [[name, s.value]] : [])),
  ) as Record<string, number | Record<string, number>>;
  const valley = analysis.valley;
  return {
    verdict: judged.verdict,
    verdictReason: judged.reason,
    parameters,
    fixed,
    n: analysis.n,
    p: analysis.p,
    chiSquare: analysis.chiSquare,
    reducedChiSquare: analysis.reducedChiSquare,
    aicc: analysis.aicc,
    bic: analysis.bic,
    residuals,
    turingAtFit: Object.fromEntries(
      checked.conditions.map((c) => [c, residuals.filter((r) => r.condition === c).every((r) => r.turing)]),
    ),
    identifiability: {
      identifiable: analysis.identifiability.identifiable,
      reasons: analysis.identifiability.reasons,
      singularRatio: analysis.identifiability.singularRatio,
      valley: valley
        ? {
            parameter: names[valley.parameterIndex],
            points: valley.points.map((pt) => ({
              params: record(pt.params),
              deltaChiSquare: pt.deltaChiSquare,
              withinConfidence: pt.withinConfidence,
            })),
          }
        : null,
    },
    convergence: {
      converged: solution.converged,
      reason: solution.reason,
      iterations: solution.iterations,
      evaluations: solution.evaluations,
      starts: solution.starts,
    },
    outsideTuring: judged.outsideTuring,
    notes,
    warnings,
    dataFingerprint: fingerprint(spec as WavelengthFitSpec<unknown>),
    profileDelta: analysis.profileDelta,
  };
}
