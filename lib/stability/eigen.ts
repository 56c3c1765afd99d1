/**
 * Eigenvalues of the small real matrices of linear stability: a closed form for 2×2
 * (σ = tr/2 ± √(tr²/4 − det), Murray 2003 §2.3) and ml-matrix's EigenvalueDecomposition
 * (Hessenberg QR, from JAMA) for n > 2. Matrices are row-major Float64Arrays.
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";

/**
 * Leading eigenvalue (largest real part) of the n×n matrix `m`: writes re → out[0] and
 * |im| → out[1]. Allocation-free for n = 2.
 */
export function leadingEigenvalue(m: ArrayLike<number>, n: number, out: Float64Array): void {
  if (n === 2) {
    const tr = m[0] + m[3];
    const det = m[0] * m[3] - m[1] * m[2];
    const half = 0.5 * tr;
    const disc = half * half - det;
    if (disc >= 0) {
      out[0] = half + Math.sqrt(disc);
      out[1] = 0;
    } else {
      out[0] = half;
      out[1] = Math.sqrt(-disc);
    }
    return;
  }
  const { re, im } = eigenvalues(m, n);
  let best = 0;
  for (let i = 1; i < n; i++)
    if (re[i] > re[best] || (re[i] === re[best] && Math.abs(im[i]) > Math.abs(im[best]))) best = i;
  out[0] = re[best];
  out[1] = Math.abs(im[best]);
}

/** All eigenvalues of the n×n row-major matrix `m`, sorted by decreasing real part. */
export function eigenvalues(m: ArrayLike<number>, n: number): { re: number[]; im: number[] } {
  if (n === 1) return { re: [m[0]], im: [0] };
  if (n === 2) {
    const tr = m[0] + m[3];
    const det = m[0] * m[3] - m[1] * m[2];
    const disc = 0.25 * tr * tr - det;
    if (disc >= 0) {
      const s = Math.sqrt(disc);
      return { re: [0.5 * tr + s, 0.5 * tr - s], im: [0, 0] };
    }
    const s = Math.sqrt(-disc);
    return { re: [0.5 * tr, 0.5 * tr], im: [s, -s] };
  }
  const rows: number[][] = [];
  for (let i = 0; i < n; i++) rows.push(Array.from({ length: n }, (_, j) => m[i * n + j]));
  const e = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: false });
  const order = e.realEigenvalues
    .map((_, i) => i)
    .sort(
      (a, b) => e.realEigenvalues[b] - e.realEigenvalues[a] || e.imaginaryEigenvalues[b] - e.imaginaryEigenvalues[a],
    );
  return { re: order.map((i) => e.realEigenvalues[i]), im: order.map((i) => e.imaginaryEigenvalues[i]) };
}

/** Writes M = J − k²D (n×n row-major) into `out`. */
export function shiftedJacobian(
  J: ArrayLike<number>,
  D: ArrayLike<number>,
  k2: number,
  n: number,
  out: Float64Array,
): void {
  const nn = n * n;
  for (let i = 0; i < nn; i++) out[i] = J[i] - k2 * D[i];
}

/** Frobenius norm of an n×n matrix. */
export function frobeniusNorm(m: ArrayLike<number>, n: number): number {
  let s = 0;
  for (let i = 0; i < n * n; i++) s += m[i] * m[i];
  return Math.sqrt(s);
}
