import { Matrix, SingularValueDecomposition } from "ml-matrix";

/** Singular values below this fraction of the largest mark a direction the data cannot pin. */
export const SINGULAR_RATIO_LIMIT = 1e-8;

/** Covariance and the singular-value picture of the Jacobian at the solution (natural units). */
export interface CovarianceReport {
  /** Cov(θ) = (JᵀWJ)⁻¹ × `scale`; null when J is singular (ratio < 1e-8) or n ≤ p. */
  covariance: number[][] | null;
  /** √diag(Cov); null where the covariance is unavailable. */
  standardErrors: (number | null)[];
  /** 1 for absolute uncertainties, χ²/(n − p) otherwise. */
  scale: number;
  /**
   * Singular values of J with each column multiplied by |θⱼ| (sensitivity to a relative change of
   * θⱼ), largest first, padded with zeros to p; the scaling makes the ratio test independent of units.
   */
  singularValues: number[];
  /** Smallest / largest singular value (0 when n < p). */
  singularRatio: number;
  /** Unit directions (in relative-change coordinates) whose singular value is below the limit. */
  nullDirections: number[][];
}

/**
 * Cov(θ) = (JᵀJ)⁻¹ for weighted residuals (so W is already inside J), computed from the SVD of the
 * column-scaled J as S·V·Σ⁻²·Vᵀ·S (avoids forming JᵀJ, whose condition number is squared). With
 * `absolute` false the covariance is multiplied by χ²/(n − p), the usual estimate when the sᵢ are
 * only relative (this is how NIST StRD's certified standard deviations are defined).
 */
export function computeCovariance(
  jacobian: Matrix,
  params: readonly number[],
  typical: readonly number[],
  chiSquare: number,
  absolute: boolean,
): CovarianceReport {
  const n = jacobian.rows;
  const p = jacobian.columns;
  const colScale = params.map((v, j) => (v !== 0 && Number.isFinite(v) ? Math.abs(v) : typical[j]));
  const Js = jacobian.clone();
  for (let j = 0; j < p; j++) for (let i = 0; i < n; i++) Js.set(i, j, Js.get(i, j) * colScale[j]);
  const svd = new SingularValueDecomposition(Js, { autoTranspose: true });
  const sv = svd.diagonal.slice(0, p);
  while (sv.length < p) sv.push(0);
  const V = svd.rightSingularVectors;
  const largest = sv[0] ?? 0;
  const singularRatio = largest > 0 ? sv[p - 1] / largest : 0;
  const basis: number[][] = [];
  for (let c = 0; c < Math.min(V.columns, p); c++) basis.push(V.getColumn(c));
  while (basis.length < p) basis.push(completeBasis(basis, p));
  const nullDirections = basis.filter((_, k) => !(largest > 0) || sv[k] < SINGULAR_RATIO_LIMIT * largest);
  const scale = absolute ? 1 : n > p ? chiSquare / (n - p) : NaN;
  if (nullDirections.length > 0 || !Number.isFinite(scale)) {
    return {
      covariance: null,
      standardErrors: new Array(p).fill(null),
      scale,
      singularValues: sv,
      singularRatio,
      nullDirections,
    };
  }
  const cov: number[][] = [];
  for (let a = 0; a < p; a++) {
    cov.push([]);
    for (let b = 0; b < p; b++) {
      let s = 0;
      for (let k = 0; k < p; k++) s += (V.get(a, k) * V.get(b, k)) / (sv[k] * sv[k]);
      cov[a].push(s * colScale[a] * colScale[b] * scale);
    }
  }
  return {
    covariance: cov,
    standardErrors: cov.map((row, j) => Math.sqrt(row[j])),
    scale,
    singularValues: sv,
    singularRatio,
    nullDirections,
  };
}

/** With n < p the SVD returns only n right vectors; add one more orthonormal vector (Gram–Schmidt). */
function completeBasis(basis: number[][], p: number): number[] {
  for (let e = 0; e < p; e++) {
    const v = new Array<number>(p).fill(0);
    v[e] = 1;
    for (const b of basis) {
      const d = b.reduce((s, x, i) => s + x * v[i], 0);
      for (let i = 0; i < p; i++) v[i] -= d * b[i];
    }
    const nrm = Math.hypot(...v);
    if (nrm > 1e-6) return v.map((x) => x / nrm);
  }
  return new Array<number>(p).fill(0);
}
