import { badOption } from "./errors";
import { DEFAULT_LIBRARY_STAGE, type LibraryStageOptions } from "./library-stage";
import { DEFAULT_POLISH, type PolishOptions } from "./polish-levenberg-marquardt";

/** Options of {@link solveLeastSquares}. Parameters are in natural units. */
export interface LeastSquaresOptions {
  /** The given starting point, one value per parameter. */
  start: readonly number[];
  /** Lower bounds. @default −∞ for every parameter */
  lower?: readonly number[];
  /** Upper bounds. @default +∞ for every parameter */
  upper?: readonly number[];
  /** Per parameter: optimise ln θ instead of θ (needs θ > 0). @default false for every parameter */
  log?: readonly boolean[];
  /**
   * Extra deterministic starts drawn from `seed`: uniform in the box (log-uniform for log-scaled
   * parameters) where both bounds are finite, otherwise the start ± one typical magnitude.
   * @default 0
   */
  seededStarts?: number;
  /** Further explicit starting points (natural units, each within the bounds). @default [] */
  extraStarts?: readonly (readonly number[])[];
  /** Seed of the extra starts; the same seed gives the same starts. @default "morphokin" */
  seed?: string;
  /**
   * When to run ml-levenberg-marquardt before the polishing LM: `"fallback"` only when polishing
   * from the start alone does not converge, `"always"` before every polish, `"off"` never.
   * @default "fallback"
   */
  libraryStage?: "fallback" | "always" | "off";
  /** Overrides for the library stage. */
  library?: Partial<LibraryStageOptions>;
  /** Overrides for the polishing stage. */
  polish?: Partial<PolishOptions>;
}

export interface ResolvedSolverOptions {
  start: number[];
  lower: number[];
  upper: number[];
  log: boolean[];
  seededStarts: number;
  extraStarts: number[][];
  seed: string;
  libraryStage: "fallback" | "always" | "off";
  library: LibraryStageOptions;
  polish: PolishOptions;
}

function checkVector(name: string, v: readonly number[] | undefined, p: number, fill: number): number[] {
  if (v === undefined) return new Array<number>(p).fill(fill);
  if (v.length !== p) throw badOption(name, `${name} must hold ${p} values (one per parameter); got ${v.length}.`);
  v.forEach((x, j) => {
    if (Number.isNaN(x)) throw badOption(`${name}[${j}]`, `${name}[${j}] must be a number; got NaN.`);
  });
  return Array.from(v);
}

/** Validate and default the solver options once, before any residual is evaluated. */
export function resolveSolverOptions(options: LeastSquaresOptions, parameterCount: number): ResolvedSolverOptions {
  const p = parameterCount;
  if (!Array.isArray(options.start) || options.start.length === 0)
    throw badOption("start", "start must hold at least one parameter value.");
  if (options.start.length !== p)
    throw badOption("start", `start must hold ${p} values (one per parameter); got ${options.start.length}.`);
  const start = Array.from(options.start);
  start.forEach((x, j) => {
    if (!Number.isFinite(x)) throw badOption(`start[${j}]`, `start[${j}] must be a finite number; got ${x}.`);
  });
  const lower = checkVector("lower", options.lower, p, -Infinity);
  const upper = checkVector("upper", options.upper, p, Infinity);
  const log = options.log === undefined ? new Array<boolean>(p).fill(false) : Array.from(options.log);
  if (log.length !== p) throw badOption("log", `log must hold ${p} flags (one per parameter); got ${log.length}.`);
  for (let j = 0; j < p; j++) {
    if (!(lower[j] < upper[j]))
      throw badOption(`lower[${j}]`, `lower[${j}] (${lower[j]}) must be below upper[${j}] (${upper[j]}).`);
    if (start[j] < lower[j] || start[j] > upper[j])
      throw badOption(
        `start[${j}]`,
        `start[${j}] (${start[j]}) must lie within [lower, upper] = [${lower[j]}, ${upper[j]}].`,
      );
    if (log[j] && !(start[j] > 0))
      throw badOption(`start[${j}]`, `start[${j}] must be positive for a log-scaled parameter; got ${start[j]}.`);
    if (log[j] && lower[j] < 0)
      throw badOption(`lower[${j}]`, `lower[${j}] must be 0 or more for a log-scaled parameter; got ${lower[j]}.`);
  }
  const extraStarts = (options.extraStarts ?? []).map((s, k) => {
    if (s.length !== p)
      throw badOption(
        `extraStarts[${k}]`,
        `extraStarts[${k}] must hold ${p} values (one per parameter); got ${s.length}.`,
      );
    s.forEach((x, j) => {
      if (!(x >= lower[j] && x <= upper[j]) || (log[j] && !(x > 0)))
        throw badOption(
          `extraStarts[${k}]`,
          `extraStarts[${k}][${j}] (${x}) must lie within [lower, upper] = [${lower[j]}, ${upper[j]}].`,
        );
    });
    return Array.from(s);
  });
  const seededStarts = options.seededStarts ?? 0;
  if (!Number.isInteger(seededStarts) || seededStarts < 0 || seededStarts > 1000)
    throw badOption("seededStarts", `seededStarts must be an integer from 0 to 1000; got ${seededStarts}.`);
  const libraryStage = options.libraryStage ?? "fallback";
  if (!["fallback", "always", "off"].includes(libraryStage))
    throw badOption("libraryStage", `libraryStage must be "fallback", "always" or "off"; got "${libraryStage}".`);
  const polish = { ...DEFAULT_POLISH, ...options.polish };
  if (!Number.isInteger(polish.maxIterations) || polish.maxIterations < 1)
    throw badOption(
      "polish.maxIterations",
      `polish.maxIterations must be a positive integer; got ${polish.maxIterations}.`,
    );
  const library = { ...DEFAULT_LIBRARY_STAGE, ...options.library };
  if (!Number.isInteger(library.maxIterations) || library.maxIterations < 1)
    throw badOption(
      "library.maxIterations",
      `library.maxIterations must be a positive integer; got ${library.maxIterations}.`,
    );
  return {
    start,
    lower,
    upper,
    log,
    seededStarts,
    extraStarts,
    seed: options.seed ?? "morphokin",
    libraryStage,
    library,
    polish,
  };
}
