import { SpacingError } from "./errors";
import { summarize, type Summary } from "./summarize";

export interface PositionSpacings {
  /** Successive differences of the sorted positions. */
  spacings: Float64Array;
  summary: Summary;
  /** (last − first)/(n − 1), equal to the mean successive spacing (telescoping sum). */
  meanSpacing: number;
}

/** Sorts 1-D positions (e.g. along a row of placodes) and takes successive spacings. */
export function spacingsFromPositions(positions: ArrayLike<number>): PositionSpacings {
  const p = Float64Array.from(positions).sort();
  if (p.length < 3)
    throw new SpacingError(`At least 3 positions are needed for a spacing summary (got ${p.length}).`, "positions");
  const spacings = new Float64Array(p.length - 1);
  for (let i = 1; i < p.length; i++) spacings[i - 1] = p[i] - p[i - 1];
  return { spacings, summary: summarize(spacings), meanSpacing: (p[p.length - 1] - p[0]) / (p.length - 1) };
}
