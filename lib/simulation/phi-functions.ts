/**
 * φ-functions of exponential integrators: φ1(z) = (e^z − 1)/z, φ2(z) = (e^z − 1 − z)/z²,
 * with φ1(0) = 1, φ2(0) = ½ (Hochbruck M. & Ostermann A. (2010) Acta Numerica 19:209).
 * For |z| < 1 the Taylor series φ_j(z) = Σ z^m/(m + j)! avoids the cancellation of the closed
 * form (Kassam A.-K. & Trefethen L.N. (2005) SIAM J. Sci. Comput. 26:1214 discuss the problem).
 */
export function phi1(z: number): number {
  if (Math.abs(z) >= 1) return Math.expm1(z) / z;
  return taylor(z, 1);
}

/** See {@link phi1}. */
export function phi2(z: number): number {
  if (Math.abs(z) >= 1) return (Math.expm1(z) - z) / (z * z);
  return taylor(z, 2);
}

function taylor(z: number, j: number): number {
  // Σ_{m=0}^{20} z^m/(m+j)!, truncation < 1/22! for |z| < 1.
  let term = 1;
  for (let q = 2; q <= j; q++) term /= q;
  let sum = term;
  for (let m = 1; m <= 20; m++) {
    term *= z / (m + j);
    sum += term;
  }
  return sum;
}
