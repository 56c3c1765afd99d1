/** A field of one species over the grid cells (row-major, index = iy·nx + ix). */
export type FieldArray = Float64Array | Float32Array;

/**
 * Parameter values seen by a reaction system: a number where the parameter is uniform, or a
 * per-cell array (length = cell count) where it varies in space.
 */
export type ReactionParams = Readonly<Record<string, number | Float64Array>>;

/** Half-open range of cell indices [start, end). */
export interface CellRange {
  start: number;
  end: number;
}

/**
 * Reaction terms R(c; p) of a reaction–diffusion model ∂c/∂t = R(c) + D∇²c (SCIENCE.md §1),
 * evaluated for many cells at once so the solver never allocates per cell.
 */
export interface ReactionSystem {
  /** Number of species n (1 … SIMULATION_LIMITS.maxSpecies). */
  readonly species: number;
  /** Species names for results, e.g. `["u", "v"]`. */
  readonly speciesNames?: readonly string[];
  /**
   * Writes out[s][i] = R_s(c(i); p(i)) in 1/s × concentration for every cell i of `range`
   * (all cells when omitted). Must not allocate per cell; must not read `out` before writing it.
   */
  evaluate(fields: readonly FieldArray[], params: ReactionParams, out: readonly FieldArray[], range?: CellRange): void;
  /**
   * Optional analytic Jacobian ∂R_i/∂c_j at one state, row-major n×n into `out`.
   * When missing the solver uses central differences of `evaluate`.
   */
  jacobian?(state: ArrayLike<number>, params: Readonly<Record<string, number>>, out: Float64Array): void;
}

/** Reads parameter `value` at cell i (uniform number or per-cell array). */
export function paramAt(value: number | Float64Array, i: number): number {
  return typeof value === "number" ? value : value[i];
}
