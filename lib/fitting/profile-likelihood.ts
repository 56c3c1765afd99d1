import { fitWithFixed, type SolverContext } from "./fit-with-fixed";

/** Δχ² for a 95 % interval on one parameter: the 0.95 quantile of χ² with 1 degree of freedom (1.959964²). */
export const PROFILE_DELTA_95 = 3.841458820694124;

/** One side of a profile-likelihood interval. */
export interface ProfileSide {
  /** The limit (natural units), or null when Δχ² never reached the threshold on this side. */
  limit: number | null;
  /** `bound`: the parameter's bound was reached first; `range`: the search range ran out. */
  openReason: "bound" | "range" | null;
  /**
   * The limit is where the model stops giving an admissible prediction (for wavelength fits: the
   * edge of the Turing region), reached before Δχ² rose by the threshold.
   */
  edge: boolean;
}

/** Profile of one parameter: the re-optimised χ² as the parameter is moved away from its estimate. */
export interface ProfileLikelihood {
  lower: ProfileSide;
  upper: ProfileSide;
  /** Visited admissible points, sorted by value: the parameter (natural units), Δχ² and the full re-optimised parameter vector. */
  points: { value: number; deltaChiSquare: number; params: number[] }[];
  /** Neither side rose by the threshold: the data do not bound this parameter. */
  flat: boolean;
  /** Lowest χ² met while profiling, when it is below the fit's (the fit was then not the global minimum). */
  lowerChiSquareFound: number | null;
}

export interface ProfileOptions {
  /** Δχ² defining the interval. @default 3.841458820694124 (95 %, 1 parameter) */
  delta: number;
  /** Doubling steps before a side is declared open. @default 12 */
  maxSteps: number;
  /** Root-finding iterations on each side. @default 20 */
  maxRootIterations: number;
}

/** The crossing is accepted when |Δχ² − delta| is below this fraction of delta (limits to ~0.1 % of the interval width). */
const ROOT_TOLERANCE = 1e-3;

export const DEFAULT_PROFILE: ProfileOptions = { delta: PROFILE_DELTA_95, maxSteps: 12, maxRootIterations: 20 };

/**
 * Profile likelihood of coordinate `j` (Raue et al. 2009, Bioinformatics 25:1923): hold θⱼ at
 * trial values, re-optimise the others, and find where χ² has risen by `delta` above its
 * minimum. Each side is bracketed by doubling steps from `firstStep` (solver coordinates; about
 * one standard error), then the crossing is located by the Illinois variant of regula falsi.
 */
export function profileParameter(
  ctx: SolverContext,
  uHat: readonly number[],
  chiMin: number,
  j: number,
  firstStep: number,
  toNaturalValue: (u: number[]) => number[],
  options: ProfileOptions = DEFAULT_PROFILE,
): ProfileLikelihood {
  const points: ProfileLikelihood["points"] = [
    { value: toNaturalValue(uHat.slice())[j], deltaChiSquare: 0, params: toNaturalValue(uHat.slice()) },
  ];
  let lowest = chiMin;
  const evaluate = (value: number, warm: readonly number[]) => {
    const fit = fitWithFixed(ctx, j, value, warm);
    const d = fit.chiSquare - chiMin;
    const params = toNaturalValue(fit.u);
    if (Number.isFinite(d)) points.push({ value: params[j], deltaChiSquare: d, params });
    if (fit.chiSquare < lowest) lowest = fit.chiSquare;
    return { d, u: fit.u };
  };
  const side = (dir: 1 | -1): ProfileSide => {
    const bound = dir > 0 ? ctx.space.upperU[j] : ctx.space.lowerU[j];
    let a = uHat[j];
    let da = 0;
    let warm = uHat.slice();
    let h = firstStep;
    for (let step = 0; step < options.maxSteps; step++) {
      const raw = uHat[j] + dir * h;
      const hitBound = dir > 0 ? raw >= bound : raw <= bound;
      const b = hitBound ? bound : raw;
      const { d: db, u } = evaluate(b, warm);
      if (!(db < options.delta)) {
        const found = locate(a, da, b, db, warm);
        return { limit: toNaturalValue(found.u)[j], openReason: null, edge: found.edge };
      }
      if (hitBound) return { limit: null, openReason: "bound", edge: false };
      a = b;
      da = db;
      warm = u;
      h *= 2;
    }
    return { limit: null, openReason: "range", edge: false };
  };
  // Illinois regula falsi on g(v) = Δχ²(v) − delta between a (g < 0) and b (g ≥ 0); plain
  // bisection while b is inadmissible (χ² = ∞), which converges on the edge of the admissible region.
  const locate = (
    a0: number,
    da0: number,
    b0: number,
    db0: number,
    warm0: number[],
  ): { u: number[]; edge: boolean } => {
    let [a, b] = [a0, b0];
    let [ga, gb] = [da0 - options.delta, db0 - options.delta];
    let bInf = !Number.isFinite(db0);
    let warmA = warm0;
    let last: number[] | null = null;
    let lastSide = 0;
    for (let it = 0; it < options.maxRootIterations; it++) {
      const c = bInf || !(gb > ga) ? (a + b) / 2 : b - (gb * (b - a)) / (gb - ga);
      const { d, u } = evaluate(c, warmA);
      if (!Number.isFinite(d)) {
        b = c;
        bInf = true;
      } else {
        const gc = d - options.delta;
        if (Math.abs(gc) < ROOT_TOLERANCE * options.delta) return { u, edge: false };
        if (gc < 0) {
          a = c;
          ga = gc;
          warmA = u;
          if (lastSide === -1 && !bInf) gb /= 2;
          lastSide = -1;
        } else {
          b = c;
          gb = gc;
          bInf = false;
          last = u;
          if (lastSide === 1) ga /= 2;
          lastSide = 1;
        }
      }
      if (Math.abs(b - a) < 1e-10 * (Math.abs(b) + ctx.typical[j])) break;
    }
    if (bInf) return { u: warmA, edge: true };
    const u = last ?? warmA.slice();
    u[j] = b;
    return { u, edge: false };
  };
  const upper = side(1);
  const lower = side(-1);
  points.sort((p, q) => p.value - q.value);
  return {
    lower,
    upper,
    points,
    flat: lower.limit === null && upper.limit === null,
    lowerChiSquareFound: lowest < chiMin - 1e-9 * Math.max(1, chiMin) ? lowest : null,
  };
}
