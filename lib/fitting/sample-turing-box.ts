import seedrandom from "seedrandom";
import type { FreeSlot } from "./resolve-wavelength-spec";
import type { WavelengthModel } from "./wavelength-model";

/** One sampled point of the parameter box. */
export interface BoxSample {
  free: number[];
  /** Every condition's prediction is Turing-unstable. */
  turing: boolean;
  /** χ² counting only Turing predictions (∞ when any is missing) and counting any finite prediction. */
  chiSquareTuring: number;
  chiSquareAny: number;
}

const sumSquares = (r: Float64Array) => {
  let s = 0;
  for (const x of r) s += x * x;
  return Number.isFinite(s) ? s : Infinity;
};

/**
 * The start plus `count` seeded points, uniform in the box (log-uniform for log-scaled
 * parameters), each classified by the predictor: finds the Turing region and good starts.
 */
export function sampleTuringBox(
  slots: readonly FreeSlot[],
  count: number,
  seed: string,
  model: WavelengthModel,
): BoxSample[] {
  const rng = seedrandom(`${seed}:turing-box`);
  const points: number[][] = [slots.map((s) => s.start)];
  for (let k = 0; k < count; k++) {
    points.push(
      slots.map((s) => {
        const t = rng();
        return s.log
          ? Math.exp(Math.log(s.lower) + t * (Math.log(s.upper) - Math.log(s.lower)))
          : s.lower + t * (s.upper - s.lower);
      }),
    );
  }
  return points.map((free) => {
    const predictions = model.predict(free);
    return {
      free,
      turing: predictions.every((p) => p !== null && p.turing),
      chiSquareTuring: sumSquares(model.residualsOf(predictions, "turing")),
      chiSquareAny: sumSquares(model.residualsOf(predictions, "any")),
    };
  });
}
