/**
 * The coordinates the solver works in. A parameter flagged `log` is optimised as u = ln θ, so
 * one step means the same relative change whether θ is 1e-4 or 1e4 (parameters spanning decades);
 * the others are optimised as u = θ. Bounds are carried over into the same coordinates.
 */
export interface ParameterSpace {
  /** Number of parameters. */
  size: number;
  /** Per parameter: optimised on a log scale. */
  log: readonly boolean[];
  /** Bounds in solver coordinates (−∞/+∞ where unbounded). */
  lowerU: readonly number[];
  upperU: readonly number[];
}

/** Build the solver coordinates; bounds and flags are assumed validated (`log` ⇒ lower > 0). */
export function createParameterSpace(
  lower: readonly number[],
  upper: readonly number[],
  log: readonly boolean[],
): ParameterSpace {
  const size = lower.length;
  const lowerU: number[] = [];
  const upperU: number[] = [];
  for (let j = 0; j < size; j++) {
    lowerU.push(log[j] ? (lower[j] > 0 ? Math.log(lower[j]) : -Infinity) : lower[j]);
    upperU.push(log[j] ? Math.log(upper[j]) : upper[j]);
  }
  return { size, log, lowerU, upperU };
}

/** Solver coordinates → natural parameters. */
export function toNatural(space: ParameterSpace, u: readonly number[]): number[] {
  return u.map((v, j) => (space.log[j] ? Math.exp(v) : v));
}

/** Natural parameters → solver coordinates. */
export function toInternal(space: ParameterSpace, theta: readonly number[]): number[] {
  return theta.map((v, j) => (space.log[j] ? Math.log(v) : v));
}

/** Clamp solver coordinates into the box. */
export function clampToBox(space: ParameterSpace, u: readonly number[]): number[] {
  return u.map((v, j) => Math.min(Math.max(v, space.lowerU[j]), space.upperU[j]));
}

/**
 * A typical magnitude per coordinate, used to size finite-difference steps and to rescale the
 * library stage: |u| at the start, or 1 when that is zero or the coordinate is logarithmic.
 */
export function typicalScale(space: ParameterSpace, u0: readonly number[]): number[] {
  return u0.map((v, j) => (space.log[j] || v === 0 || !Number.isFinite(v) ? 1 : Math.abs(v)));
}
