/**
 * Linear stability of one homogeneous steady state: σ_max(k) on a grid, local maxima at
 * k > 0 refined (golden section), unstable bands with edges refined by Brent's method, and
 * the class flags (SCIENCE.md §1).
 */
import type { CompiledKinetics } from "../kinetics/types";
import { checkDiffusion } from "./diffusion-check";
import {
  chooseKMax,
  classifyAtZero,
  classifyPeak,
  createScanWorkspace,
  isInteriorMax,
  refinePeak,
  scanGrid,
  sigmaAt,
  tolerancesFor,
  type Peak,
  type ScanWorkspace,
} from "./dispersion-scan";
import { findRootBracketed } from "./roots";

export interface ScanOptions {
  /** Equal steps of the k grid. @default 200 */
  gridSize?: number;
  /** Upper end of the grid, model units⁻¹. @default 1.5·√(‖J‖_F / d_min) */
  kMax?: number;
}

export interface ClassifiedPeak extends Peak {
  kind: "turing" | "wave";
}

export interface StateAnalysis {
  flags: number;
  peaks: ClassifiedPeak[];
  /** The fastest-growing peak at k > 0, or null when no k > 0 maximum grows. */
  fastest: ClassifiedPeak | null;
  /** Intervals [kLow, kHigh] (model units⁻¹) where σ_max > 0. */
  bands: [number, number][];
  kMax: number;
  /** Smallest diffusivity (bounds the k grid). */
  dMin: number;
  tol: number;
  imTol: number;
  ws: ScanWorkspace;
}

/** Analyses the state `c` of `kinetics` at parameters `p`. */
export function analyseState(
  kinetics: CompiledKinetics,
  p: ArrayLike<number>,
  c: ArrayLike<number>,
  options: ScanOptions = {},
): StateAnalysis {
  const n = kinetics.species.length;
  const gridSize = options.gridSize ?? 200;
  const ws = createScanWorkspace(n, gridSize);
  kinetics.jacobian(c, p, ws.J);
  kinetics.diffusion(p, ws.D);
  const dMin = checkDiffusion(ws.D, n, kinetics.species);
  const kMax = options.kMax ?? chooseKMax(ws.J, n, dMin);
  const { tol, imTol } = tolerancesFor(ws.J, n);
  let extra = NaN;
  if (n === 2 && kinetics.diagonalDiffusion) {
    // k minimising det(J − k²D) (Murray 2003 §2.3) joins the grid so narrow bands are not missed.
    const km2 = (ws.D[3] * ws.J[0] + ws.D[0] * ws.J[3]) / (2 * ws.D[0] * ws.D[3]);
    if (km2 > 0) extra = Math.sqrt(km2);
  }
  scanGrid(ws, kMax, gridSize, extra);
  let flags = classifyAtZero(ws, tol, imTol);
  const peaks: ClassifiedPeak[] = [];
  for (let i = 1; i < ws.size - 1; i++) {
    if (!isInteriorMax(ws, i) || !(ws.re[i] > -Math.abs(tol))) continue;
    const peak: Peak = { k: 0, sigma: 0, imSigma: 0 };
    refinePeak(ws, i, peak);
    const flag = classifyPeak(peak, tol, imTol);
    if (flag) {
      flags |= flag;
      peaks.push({ ...peak, kind: peak.imSigma > imTol ? "wave" : "turing" });
    }
  }
  const bands = findBands(ws, kMax);
  const fastest = peaks.reduce<ClassifiedPeak | null>(
    (best, q) => (best === null || q.sigma > best.sigma ? q : best),
    null,
  );
  return { flags, peaks, fastest, bands, kMax, dMin, tol, imTol, ws };
}

function findBands(ws: ScanWorkspace, kMax: number): [number, number][] {
  const bands: [number, number][] = [];
  const f = (k: number) => sigmaAt(ws, k);
  const tol = 1e-13 * kMax;
  let start = ws.re[0] > 0 ? 0 : NaN;
  for (let i = 1; i < ws.size; i++) {
    const a = ws.re[i - 1],
      b = ws.re[i];
    if (a <= 0 && b > 0) start = findRootBracketed(f, ws.k[i - 1], ws.k[i], tol);
    else if (a > 0 && b <= 0) {
      bands.push([start, findRootBracketed(f, ws.k[i - 1], ws.k[i], tol)]);
      start = NaN;
    }
  }
  if (!Number.isNaN(start)) bands.push([start, ws.k[ws.size - 1]]);
  return bands;
}
