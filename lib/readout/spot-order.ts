import Delaunator from "delaunator";
import { computeNearestNeighbours } from "../spacing/nearest-neighbours";
import { blur } from "./flatten";

/**
 * Spots found in real space and how hexagonal their packing is. A reaction–diffusion field of spots is
 * a disordered hexagonal packing: its Fourier ring is nearly uniform (so the angular harmonics call it
 * "labyrinth"), yet each spot still has about six neighbours at about 60°. The bond-orientational order
 * ψ₆ measures that locally (Nelson & Halperin 1979, Phys. Rev. B 19:2457; Strandburg 1988,
 * Rev. Mod. Phys. 60:161): ψ₆(j) = (1/n_j) Σ_k exp(6iθ_jk) over the Delaunay neighbours k of spot j.
 */
export interface SpotOrder {
  /** Spots found (local maxima after smoothing at the readout's scale). */
  count: number;
  /** Spots far enough from the region's edge that their neighbour shell is complete. */
  interiorCount: number;
  /** Mean over interior spots of |ψ₆(j)|: 1 on a perfect hexagonal lattice. */
  psi6Local: number;
  /** |mean over interior spots of ψ₆(j)|: long-range orientational order (≈ 1/√n for random points). */
  psi6Global: number;
  /** Mean and SD of the nearest-neighbour distance of interior spots (px of the analysed grid). */
  nearestNeighbourMeanPx: number;
  nearestNeighbourSdPx: number;
  /**
   * Mean over spots of the ratio of the smaller to the larger principal curvature of the smoothed image
   * at the spot (Hessian eigenvalues): ≈ 1 for round spots, ≈ 0 for points on a ridge (stripes,
   * labyrinths). Blob versus ridge from the Hessian: Lindeberg 1998, Int. J. Comput. Vision 30:79.
   */
  roundness: number;
  /** "bright" when spots are maxima, "dark" when they are minima (brightfield). */
  polarity: "bright" | "dark";
}

/** Hexagonal nearest-neighbour distance a = 2λ/√3 for a Fourier wavelength λ (SCIENCE.md §4). */
const hexSpacing = (wavelengthPx: number) => (2 * wavelengthPx) / Math.sqrt(3);

/**
 * Local maxima of `data` smoothed with a Gaussian of σ = λ/6, each the largest within a disc of radius
 * 0.4·a, above the smoothed image's mean, refined to sub-pixel by a 3-point parabola per axis.
 * Pixels outside `included` (when given) hold no spots.
 */
export function detectSpots(
  data: Float32Array,
  width: number,
  height: number,
  wavelengthPx: number,
  included: Uint8Array | null = null,
  polarity: "bright" | "dark" = "bright",
): { xs: Float64Array; ys: Float64Array; roundness: number } {
  const src = polarity === "bright" ? data : data.map((v) => -v);
  const s = blur(src, width, height, wavelengthPx / 6);
  let sum = 0,
    n = 0;
  for (let i = 0; i < s.length; i++)
    if (!included || included[i]) {
      sum += s[i];
      n++;
    }
  const floor = n > 0 ? sum / n : 0;
  const r = Math.max(1, Math.floor(0.4 * hexSpacing(wavelengthPx)));
  const r2 = r * r;
  const xs: number[] = [],
    ys: number[] = [];
  let roundSum = 0;
  for (let y = 1; y < height - 1; y++) {
    for (let x = 1; x < width - 1; x++) {
      const i = y * width + x;
      const v = s[i];
      if (v <= floor || (included && !included[i])) continue;
      // Cheap 3×3 test first; the disc test only for the few survivors.
      if (v < s[i - 1] || v < s[i + 1] || v < s[i - width] || v < s[i + width]) continue;
      let isMax = true;
      for (let dy = -r; dy <= r && isMax; dy++) {
        const yy = y + dy;
        if (yy < 0 || yy >= height) continue;
        for (let dx = -r; dx <= r; dx++) {
          const xx = x + dx;
          if (xx < 0 || xx >= width || dx * dx + dy * dy > r2 || (dx === 0 && dy === 0)) continue;
          const w = s[yy * width + xx];
          // Ties go to the first pixel in raster order, so a flat top gives one spot.
          if (w > v || (w === v && (dy < 0 || (dy === 0 && dx < 0)))) {
            isMax = false;
            break;
          }
        }
      }
      if (!isMax) continue;
      roundSum += measureRoundness(s, width, i);
      xs.push(x + parabolaOffset(s[i - 1], v, s[i + 1]));
      ys.push(y + parabolaOffset(s[i - width], v, s[i + width]));
    }
  }
  return { xs: Float64Array.from(xs), ys: Float64Array.from(ys), roundness: xs.length ? roundSum / xs.length : 0 };
}

/** Ratio of the smaller to the larger |eigenvalue| of the 3×3 finite-difference Hessian at pixel i. */
function measureRoundness(s: Float32Array, width: number, i: number): number {
  const hxx = s[i - 1] - 2 * s[i] + s[i + 1];
  const hyy = s[i - width] - 2 * s[i] + s[i + width];
  const hxy = (s[i + width + 1] - s[i + width - 1] - s[i - width + 1] + s[i - width - 1]) / 4;
  const mean = (hxx + hyy) / 2;
  const r = Math.hypot((hxx - hyy) / 2, hxy);
  const big = Math.abs(mean) + r;
  return big > 0 ? Math.max(0, Math.abs(mean) - r) / big : 0;
}

function parabolaOffset(l: number, c: number, r: number): number {
  const d = l - 2 * c + r;
  return d < 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (l - r)) / d)) : 0;
}

/**
 * ψ₆ over the Delaunay neighbours of each spot, averaged over spots at least `marginPx` from the
 * region's edge (their neighbour shell is complete).
 */
export function measureBondOrder(
  xs: Float64Array,
  ys: Float64Array,
  width: number,
  height: number,
  marginPx: number,
): { psi6Local: number; psi6Global: number; interior: Uint8Array } {
  const n = xs.length;
  const interior = new Uint8Array(n);
  if (n < 3) return { psi6Local: 0, psi6Global: 0, interior };
  const coords = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    coords[2 * i] = xs[i];
    coords[2 * i + 1] = ys[i];
  }
  const d = new Delaunator(coords);
  const re = new Float64Array(n),
    im = new Float64Array(n),
    deg = new Uint16Array(n);
  // Each interior Delaunay edge appears as two half-edges; hull edges once. Count each edge once.
  for (let e = 0; e < d.triangles.length; e++) {
    const twin = d.halfedges[e];
    if (twin !== -1 && twin < e) continue;
    const a = d.triangles[e];
    const b = d.triangles[e % 3 === 2 ? e - 2 : e + 1];
    const t = 6 * Math.atan2(ys[b] - ys[a], xs[b] - xs[a]);
    // exp(6iθ) is the same for θ and θ + π, so one angle serves both ends of the bond.
    const c = Math.cos(t),
      s = Math.sin(t);
    re[a] += c;
    im[a] += s;
    re[b] += c;
    im[b] += s;
    deg[a]++;
    deg[b]++;
  }
  let localSum = 0,
    gRe = 0,
    gIm = 0,
    count = 0;
  for (let i = 0; i < n; i++) {
    if (xs[i] < marginPx || ys[i] < marginPx || xs[i] > width - 1 - marginPx || ys[i] > height - 1 - marginPx) continue;
    if (deg[i] === 0) continue;
    interior[i] = 1;
    const pr = re[i] / deg[i],
      pi = im[i] / deg[i];
    localSum += Math.hypot(pr, pi);
    gRe += pr;
    gIm += pi;
    count++;
  }
  if (count === 0) return { psi6Local: 0, psi6Global: 0, interior };
  return { psi6Local: localSum / count, psi6Global: Math.hypot(gRe, gIm) / count, interior };
}

/**
 * Spots are the maxima when the intensity distribution is skewed to the bright side (bright spots on a
 * darker field) and the minima when skewed to the dark side (brightfield: dark spots on light tissue);
 * the sign of the third central moment decides. Returns null when fewer than 12 interior spots are found.
 */
export function measureSpotOrder(
  data: Float32Array,
  width: number,
  height: number,
  wavelengthPx: number,
  included: Uint8Array | null = null,
): SpotOrder | null {
  const a = hexSpacing(wavelengthPx);
  const polarity = measureSkewness(data, included) >= 0 ? "bright" : "dark";
  const best = { polarity, ...detectSpots(data, width, height, wavelengthPx, included, polarity) } as const;
  const margin = 1.5 * a;
  const order = measureBondOrder(best.xs, best.ys, width, height, margin);
  const interiorCount = order.interior.reduce((s, v) => s + v, 0);
  if (interiorCount < 12) return null;
  const nn = computeNearestNeighbours(best.xs, best.ys, { minX: 0, minY: 0, maxX: width, maxY: height });
  let sum = 0,
    sum2 = 0;
  for (let i = 0; i < best.xs.length; i++)
    if (order.interior[i]) {
      sum += nn.distances[i];
      sum2 += nn.distances[i] ** 2;
    }
  const mean = sum / interiorCount;
  const sd = Math.sqrt(Math.max(0, (sum2 - interiorCount * mean * mean) / (interiorCount - 1)));
  return {
    count: best.xs.length,
    interiorCount,
    psi6Local: order.psi6Local,
    psi6Global: order.psi6Global,
    roundness: best.roundness,
    nearestNeighbourMeanPx: mean,
    nearestNeighbourSdPx: sd,
    polarity: best.polarity,
  };
}

/** Third central moment of the included pixels (sign only is used). */
function measureSkewness(data: Float32Array, included: Uint8Array | null): number {
  let n = 0,
    sum = 0;
  for (let i = 0; i < data.length; i++)
    if (!included || included[i]) {
      sum += data[i];
      n++;
    }
  const mean = n ? sum / n : 0;
  let m3 = 0;
  for (let i = 0; i < data.length; i++) if (!included || included[i]) m3 += (data[i] - mean) ** 3;
  return n ? m3 / n : 0;
}

/**
 * A field the Fourier harmonics call "labyrinth" is called spots when its local maxima are round
 * (roundness ≥ 0.6) and packed with local hexagonal order (mean |ψ₆| ≥ 0.55). The thresholds sit between
 * the values measured on simulated reaction–diffusion fields: spots 0.63–0.74 (|ψ₆|) and 0.93 (roundness),
 * labyrinths 0.44–0.48 and 0.20 (tests/lib/readout/disordered-spots.test.ts; chosen here, no published source).
 */
export const SPOT_PACKING_THRESHOLDS = { roundness: 0.6, psi6Local: 0.55 } as const;

export function isSpotPacking(o: SpotOrder | null): boolean {
  return !!o && o.roundness >= SPOT_PACKING_THRESHOLDS.roundness && o.psi6Local >= SPOT_PACKING_THRESHOLDS.psi6Local;
}

/** Largest side searched for spots: a central crop of this size holds hundreds of spots and keeps the search cheap. */
export const MAX_SPOT_SEARCH_SIDE_PX = 1024;

/** measureSpotOrder on the central crop (at most MAX_SPOT_SEARCH_SIDE_PX square) of a region. */
export function measureRegionSpotOrder(
  data: Float32Array,
  width: number,
  height: number,
  wavelengthPx: number,
  included: Uint8Array | null,
): SpotOrder | null {
  const w = Math.min(width, MAX_SPOT_SEARCH_SIDE_PX),
    h = Math.min(height, MAX_SPOT_SEARCH_SIDE_PX);
  if (w === width && h === height) return measureSpotOrder(data, width, height, wavelengthPx, included);
  const x0 = Math.floor((width - w) / 2),
    y0 = Math.floor((height - h) / 2);
  const crop = new Float32Array(w * h);
  const inc = included ? new Uint8Array(w * h) : null;
  for (let y = 0; y < h; y++) {
    const src = (y + y0) * width + x0;
    crop.set(data.subarray(src, src + w), y * w);
    if (inc && included) inc.set(included.subarray(src, src + w), y * w);
  }
  return measureSpotOrder(crop, w, h, wavelengthPx, inc);
}
