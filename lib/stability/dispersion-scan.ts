/**
 * The inner engine of the dispersion relation σ(k) = leading eigenvalue of J − k²D
 * (SCIENCE.md §1): a grid over k, local maxima refined by golden section, and the flags of
 * {@link ./classes}. Allocation-free for 2 species so Turing maps can call it per cell.
 */
import { CLASS_HOPF, CLASS_PEAK, CLASS_UNSTABLE_K0, CLASS_WAVE } from "./classes";
import { eigenvalues, frobeniusNorm, leadingEigenvalue, shiftedJacobian } from "./eigen";
import { maximiseGolden } from "./roots";

export interface ScanWorkspace {
  n: number;
  J: Float64Array;
  D: Float64Array;
  M: Float64Array;
  eig: Float64Array;
  k: Float64Array;
  re: Float64Array;
  im: Float64Array;
  /** Points in use in k/re/im. */
  size: number;
}

/** Buffers for an n-species scan with up to `gridSize` (+1 extra) wavenumbers. */
export function createScanWorkspace(n: number, gridSize: number): ScanWorkspace {
  const cap = gridSize + 1;
  return {
    n,
    J: new Float64Array(n * n),
    D: new Float64Array(n * n),
    M: new Float64Array(n * n),
    eig: new Float64Array(2),
    k: new Float64Array(cap),
    re: new Float64Array(cap),
    im: new Float64Array(cap),
    size: 0,
  };
}

/** Re σ_max(k) for ws.J, ws.D; leaves |Im| in ws.eig[1]. */
export function sigmaAt(ws: ScanWorkspace, k: number): number {
  const n = ws.n;
  if (n === 2) {
    const k2 = k * k,
      J = ws.J,
      D = ws.D;
    const a = J[0] - k2 * D[0],
      b = J[1] - k2 * D[1],
      c = J[2] - k2 * D[2],
      d = J[3] - k2 * D[3];
    const half = 0.5 * (a + d);
    const disc = half * half - (a * d - b * c);
    if (disc >= 0) {
      ws.eig[1] = 0;
      return half + Math.sqrt(disc);
    }
    ws.eig[1] = Math.sqrt(-disc);
    return half;
  }
  shiftedJacobian(ws.J, ws.D, k * k, n, ws.M);
  leadingEigenvalue(ws.M, n, ws.eig);
  return ws.eig[0];
}

/**
 * Upper end of the k grid: Re σ ≤ ‖J‖₂ − k²·d_min for positive diagonal D (numerical-range
 * bound), so no growth exists beyond k² = ‖J‖_F/d_min; the grid goes 1.5× past that.
 * `dMin` is the smallest diffusivity (or smallest eigenvalue of the symmetric part of D).
 */
export function chooseKMax(J: ArrayLike<number>, n: number, dMin: number): number {
  const norm = frobeniusNorm(J, n);
  if (!(norm > 0) || !(dMin > 0)) return 1;
  return 1.5 * Math.sqrt(norm / dMin);
}

/**
 * Fills ws.k/re/im on k = 0 … kMax (`gridSize` equal steps + the optional `extraK`, merged in order).
 */
export function scanGrid(ws: ScanWorkspace, kMax: number, gridSize: number, extraK = NaN): void {
  const h = kMax / (gridSize - 1);
  let j = 0;
  let extraPending = extraK > 0 && extraK < kMax;
  for (let i = 0; i < gridSize; i++) {
    const k = i * h;
    if (extraPending && extraK < k) {
      if (extraK > k - h) ws.k[j++] = extraK;
      extraPending = false;
    }
    ws.k[j++] = k;
  }
  ws.size = j;
  for (let i = 0; i < j; i++) {
    ws.re[i] = sigmaAt(ws, ws.k[i]);
    ws.im[i] = ws.eig[1];
  }
}

/** A refined local maximum of σ_max(k) at k > 0. */
export interface Peak {
  k: number;
  sigma: number;
  imSigma: number;
}

/** Refines the interior grid maximum at index i by golden section on [k_{i−1}, k_{i+1}]. */
export function refinePeak(ws: ScanWorkspace, i: number, out: Peak): void {
  const lo = ws.k[i - 1],
    hi = ws.k[i + 1];
  const f = (k: number) => sigmaAt(ws, k);
  const k = maximiseGolden(f, lo, hi, 1e-12 * Math.max(hi, 1e-300) + 1e-15 * hi);
  const s = sigmaAt(ws, k);
  if (s >= ws.re[i]) {
    out.k = k;
    out.sigma = s;
    out.imSigma = ws.eig[1];
  } else {
    out.k = ws.k[i];
    out.sigma = ws.re[i];
    out.imSigma = ws.im[i];
  }
}

/** True when grid index i (1 ≤ i ≤ size−2) is a local maximum of Re σ. */
export function isInteriorMax(ws: ScanWorkspace, i: number): boolean {
  return ws.re[i] >= ws.re[i - 1] && ws.re[i] > ws.re[i + 1];
}

/** Flags at k = 0 from the eigenvalues of J (real → unstable at k = 0, complex → Hopf). */
export function classifyAtZero(ws: ScanWorkspace, tol: number, imTol: number): number {
  const n = ws.n;
  if (n === 2) {
    const J = ws.J;
    const half = 0.5 * (J[0] + J[3]);
    const disc = half * half - (J[0] * J[3] - J[1] * J[2]);
    if (disc >= 0) {
      const s = Math.sqrt(disc);
      return half + s > tol ? CLASS_UNSTABLE_K0 : 0;
    }
    return half > tol ? (Math.sqrt(-disc) > imTol ? CLASS_HOPF : CLASS_UNSTABLE_K0) : 0;
  }
  const e = eigenvalues(ws.J, n);
  let flags = 0;
  for (let i = 0; i < n; i++) if (e.re[i] > tol) flags |= Math.abs(e.im[i]) > imTol ? CLASS_HOPF : CLASS_UNSTABLE_K0;
  return flags;
}

/** Flag of one refined peak: Turing if real, wave if complex, 0 if not growing. */
export function classifyPeak(peak: Peak, tol: number, imTol: number): number {
  if (!(peak.sigma > tol)) return 0;
  return peak.imSigma > imTol ? CLASS_WAVE : CLASS_PEAK;
}

/** Tolerances relative to the size of J: growth below tol counts as zero, |Im| below imTol as real. */
export function tolerancesFor(J: ArrayLike<number>, n: number): { tol: number; imTol: number } {
  const s = frobeniusNorm(J, n) || 1;
  return { tol: 1e-9 * s, imTol: 1e-7 * s };
}
