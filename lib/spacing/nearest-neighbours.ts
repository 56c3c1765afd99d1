import KDBush from "kdbush";
import { SpacingError } from "./errors";
import { summarize, type Summary } from "./summarize";

/** An axis-aligned observation field (units of the coordinates). */
export interface Field {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

export interface NearestNeighbourResult {
  /** Distance from each point to its nearest other point, input order. */
  distances: Float64Array;
  all: Summary;
  /** Points at least their NN distance from the field edge (edge-bias correction by exclusion; Ripley 1981, Spatial Statistics §4.2). */
  interior: Summary | null;
  /** Clark–Evans R = mean NN ÷ (0.5/√ρ), ρ = n/area (Clark & Evans 1954, Ecology 35:445): 1 random, ≈ 2.149 hexagonal. */
  clarkEvansR: number;
  /** Points per unit area. */
  density: number;
  field: Field;
  /** Fourier wavelength of a hexagonal packing with this mean NN distance: (√3/2)·mean (SCIENCE.md §4). */
  equivalentHexWavelength: number;
}

/** Nearest-neighbour distances of 2-D points with a k-d tree (kdbush), growing the search radius until a neighbour is found. */
export function computeNearestNeighbours(
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  field?: Field,
): NearestNeighbourResult {
  const n = xs.length;
  if (n < 2)
    throw new SpacingError(`At least 2 points are needed for nearest-neighbour distances (got ${n}).`, "points");
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  const index = new KDBush(n);
  for (let i = 0; i < n; i++) {
    index.add(xs[i], ys[i]);
    minX = Math.min(minX, xs[i]);
    maxX = Math.max(maxX, xs[i]);
    minY = Math.min(minY, ys[i]);
    maxY = Math.max(maxY, ys[i]);
  }
  index.finish();
  const f = field ?? { minX, minY, maxX, maxY };
  const area = (f.maxX - f.minX) * (f.maxY - f.minY);
  if (!(area > 0))
    throw new SpacingError(
      "The points span no area (all on one line), so the density and Clark–Evans ratio are undefined.",
      "points",
    );
  const density = n / area;
  const start = 1 / Math.sqrt(density); // ~2× the expected random NN distance 0.5/√ρ
  const distances = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = xs[i],
      y = ys[i];
    let best = Infinity;
    for (let r = start; best === Infinity; r *= 2) {
      for (const j of index.within(x, y, r)) {
        if (j === i) continue;
        const d = Math.hypot(xs[j] - x, ys[j] - y);
        if (d < best) best = d;
      }
      if (r > 1e6 * start) break;
    }
    distances[i] = best;
  }
  const interiorD: number[] = [];
  for (let i = 0; i < n; i++) {
    const edge = Math.min(xs[i] - f.minX, f.maxX - xs[i], ys[i] - f.minY, f.maxY - ys[i]);
    if (edge >= distances[i]) interiorD.push(distances[i]);
  }
  const all = summarize(distances);
  return {
    distances,
    all,
    interior: interiorD.length >= 2 ? summarize(interiorD) : null,
    clarkEvansR: all.mean / (0.5 / Math.sqrt(density)),
    density,
    field: f,
    equivalentHexWavelength: (Math.sqrt(3) / 2) * all.mean,
  };
}
