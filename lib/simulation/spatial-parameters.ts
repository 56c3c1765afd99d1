import { failOption } from "./errors";
import { cellCentreXUm, cellCentreYUm, type Grid } from "./grid";

/** Axis along which a parameter varies. */
export type SpatialAxis = "x" | "y";

/**
 * How a parameter varies in space, evaluated at cell centres:
 * - `linear`: from `fromValue` at position 0 to `toValue` at the far end of `axis`;
 * - `exponential`: value0 · exp(−position / decayLengthUm) (a morphogen source at position 0);
 * - `table`: piecewise-linear through (positionsUm[i], values[i]), constant beyond the ends;
 * - `field`: one value per cell, row-major.
 */
export type SpatialParameterField =
  | { kind: "linear"; axis?: SpatialAxis; fromValue: number; toValue: number }
  | { kind: "exponential"; axis?: SpatialAxis; value0: number; decayLengthUm: number }
  | { kind: "table"; axis?: SpatialAxis; positionsUm: readonly number[]; values: readonly number[] }
  | { kind: "field"; values: ArrayLike<number> };

/** Evaluates `profile` at every cell of `grid`; `field` names the option for error messages. */
export function evaluateSpatialParameterField(profile: SpatialParameterField, grid: Grid, field: string): Float64Array {
  const out = new Float64Array(grid.cellCount);
  if (profile.kind === "field") {
    if (profile.values.length !== grid.cellCount) {
      failOption(
        field,
        `${field}.values must have one value per cell (${grid.cellCount}), got ${profile.values.length}.`,
      );
    }
    for (let i = 0; i < out.length; i++) out[i] = profile.values[i];
    return checkFinite(out, field);
  }
  const axis = profile.axis ?? "x";
  if (axis === "y" && grid.dimensions === 1) failOption(`${field}.axis`, `${field}.axis must be "x" on a 1-D grid.`);
  const length = axis === "x" ? grid.lengthXUm : grid.lengthYUm;
  const at = profileFunction(profile, length, field);
  for (let iy = 0; iy < grid.ny; iy++) {
    for (let ix = 0; ix < grid.nx; ix++) {
      out[iy * grid.nx + ix] = at(axis === "x" ? cellCentreXUm(grid, ix) : cellCentreYUm(grid, iy));
    }
  }
  return checkFinite(out, field);
}

function profileFunction(
  profile: Exclude<SpatialParameterField, { kind: "field" }>,
  lengthUm: number,
  field: string,
): (x: number) => number {
  if (profile.kind === "linear") {
    const { fromValue: a, toValue: b } = profile;
    return (x) => a + ((b - a) * x) / lengthUm;
  }
  if (profile.kind === "exponential") {
    if (!(profile.decayLengthUm > 0))
      failOption(`${field}.decayLengthUm`, `${field}.decayLengthUm must be positive, got ${profile.decayLengthUm}.`);
    const { value0, decayLengthUm } = profile;
    return (x) => value0 * Math.exp(-x / decayLengthUm);
  }
  const { positionsUm: xs, values: ys } = profile;
  if (xs.length < 2 || xs.length !== ys.length) {
    failOption(
      field,
      `${field} needs at least 2 positions and as many values, got ${xs.length} positions and ${ys.length} values.`,
    );
  }
  for (let i = 1; i < xs.length; i++) {
    if (!(xs[i] > xs[i - 1])) failOption(`${field}.positionsUm`, `${field}.positionsUm must increase strictly.`);
  }
  return (x) => {
    if (x <= xs[0]) return ys[0];
    if (x >= xs[xs.length - 1]) return ys[ys.length - 1];
    let i = 1;
    while (xs[i] < x) i++;
    const t = (x - xs[i - 1]) / (xs[i] - xs[i - 1]);
    return ys[i - 1] + t * (ys[i] - ys[i - 1]);
  };
}

function checkFinite(out: Float64Array, field: string): Float64Array {
  for (let i = 0; i < out.length; i++) {
    if (!Number.isFinite(out[i])) failOption(field, `${field} gives a non-finite value at cell ${i}.`);
  }
  return out;
}
