/**
 * Real roots of a₃x³ + a₂x² + a₁x + a₀ = 0 (Cardano / trigonometric form, then one Newton
 * polish), written ascending into `out`; returns how many. Degenerate leading coefficients
 * fall back to the quadratic or linear formula. Allocation-free for use in map inner loops.
 */
export function solveCubicReal(a3: number, a2: number, a1: number, a0: number, out: Float64Array): number {
  const scale = Math.max(Math.abs(a3), Math.abs(a2), Math.abs(a1), Math.abs(a0));
  if (scale === 0) return 0;
  if (Math.abs(a3) <= 1e-14 * scale) return solveQuadraticReal(a2, a1, a0, out);
  const b = a2 / a3,
    c = a1 / a3,
    d = a0 / a3;
  // Depressed cubic t³ + pt + q = 0 with x = t − b/3.
  const p = c - (b * b) / 3;
  const q = (2 * b * b * b) / 27 - (b * c) / 3 + d;
  const shift = -b / 3;
  const disc = (q * q) / 4 + (p * p * p) / 27;
  let n: number;
  if (disc > 1e-14 * Math.max(1, q * q)) {
    const s = Math.sqrt(disc);
    out[0] = Math.cbrt(-q / 2 + s) + Math.cbrt(-q / 2 - s) + shift;
    n = 1;
  } else if (p === 0) {
    out[0] = shift;
    n = 1;
  } else {
    const r = 2 * Math.sqrt(-p / 3);
    const arg = Math.max(-1, Math.min(1, ((3 * q) / (p * r)) * 1));
    const phi = Math.acos(arg) / 3;
    out[0] = r * Math.cos(phi) + shift;
    out[1] = r * Math.cos(phi - (2 * Math.PI) / 3) + shift;
    out[2] = r * Math.cos(phi - (4 * Math.PI) / 3) + shift;
    n = 3;
  }
  for (let i = 0; i < n; i++) {
    const x = out[i];
    const f = ((a3 * x + a2) * x + a1) * x + a0;
    const df = (3 * a3 * x + 2 * a2) * x + a1;
    if (df !== 0 && Number.isFinite(f / df)) out[i] = x - f / df;
  }
  sortAscending(out, n);
  return n;
}

/** Real roots of a₂x² + a₁x + a₀ = 0 ascending (numerically stable form). */
export function solveQuadraticReal(a2: number, a1: number, a0: number, out: Float64Array): number {
  if (a2 === 0) {
    if (a1 === 0) return 0;
    out[0] = -a0 / a1;
    return 1;
  }
  const disc = a1 * a1 - 4 * a2 * a0;
  if (disc < 0) return 0;
  const qq = -0.5 * (a1 + Math.sign(a1 || 1) * Math.sqrt(disc));
  const r1 = qq / a2;
  const r2 = qq !== 0 ? a0 / qq : r1;
  out[0] = Math.min(r1, r2);
  out[1] = Math.max(r1, r2);
  return disc === 0 ? 1 : 2;
}

function sortAscending(a: Float64Array, n: number): void {
  for (let i = 1; i < n; i++) {
    const v = a[i];
    let j = i - 1;
    while (j >= 0 && a[j] > v) {
      a[j + 1] = a[j];
      j--;
    }
    a[j + 1] = v;
  }
}
