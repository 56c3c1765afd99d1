/**
 * Solves A x = b in place for small dense n×n systems by Gaussian elimination with partial
 * pivoting. `a` (row-major) and `b` are overwritten; x is left in `b`. Returns false when a
 * pivot is below `singularTol` × the largest entry (matrix numerically singular).
 */
export function solveLinearInPlace(a: Float64Array, b: Float64Array, n: number, singularTol = 1e-13): boolean {
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(a[i]));
  if (!(scale > 0) || !Number.isFinite(scale)) return false;
  for (let col = 0; col < n; col++) {
    let piv = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r * n + col]) > Math.abs(a[piv * n + col])) piv = r;
    if (Math.abs(a[piv * n + col]) <= singularTol * scale) return false;
    if (piv !== col) {
      for (let j = 0; j < n; j++) {
        const t = a[col * n + j];
        a[col * n + j] = a[piv * n + j];
        a[piv * n + j] = t;
      }
      const t = b[col];
      b[col] = b[piv];
      b[piv] = t;
    }
    for (let r = col + 1; r < n; r++) {
      const f = a[r * n + col] / a[col * n + col];
      if (f === 0) continue;
      for (let j = col; j < n; j++) a[r * n + j] -= f * a[col * n + j];
      b[r] -= f * b[col];
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r];
    for (let j = r + 1; j < n; j++) s -= a[r * n + j] * b[j];
    b[r] = s / a[r * n + r];
  }
  return true;
}
