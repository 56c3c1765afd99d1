import seedrandom from "seedrandom";
import type { ParameterSpace } from "./parameter-space";

/**
 * `count` deterministic starting points in solver coordinates: uniform in the box where both
 * bounds are finite (log-uniform for log-scaled parameters, since the box is then in ln θ), else
 * u₀ ± one typical magnitude, clamped into the box. Same seed, same points (seedrandom ARC4).
 */
export function drawSeededStarts(
  space: ParameterSpace,
  u0: readonly number[],
  typical: readonly number[],
  count: number,
  seed: string,
): number[][] {
  const rng = seedrandom(seed);
  const starts: number[][] = [];
  for (let s = 0; s < count; s++) {
    starts.push(
      u0.map((v, j) => {
        const lo = space.lowerU[j];
        const hi = space.upperU[j];
        const t = rng();
        if (Number.isFinite(lo) && Number.isFinite(hi)) return lo + t * (hi - lo);
        return Math.min(Math.max(v + (2 * t - 1) * typical[j], lo), hi);
      }),
    );
  }
  return starts;
}
