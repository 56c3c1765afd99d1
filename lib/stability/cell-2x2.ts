/**
 * Fast path of a Turing-map cell for two species with diagonal D, exact and grid-free. With
 * q = k², the eigenvalues of J − qD solve σ² − tr(q)σ + det(q) = 0 with tr(q) = T₀ − S q and
 * det(q) = Δ₀ − c q + P q² (S = Du + Dv, P = Du·Dv, c = Dv f_u + Du g_v, T₀ = tr J, Δ₀ = det J;
 * Murray 2003, Mathematical Biology II, §2.3).
 *
 * Where the eigenvalues are complex, σ_max = tr(q)/2 falls with q, so it has no maximum at q > 0.
 * Where they are real, σ_max = tr/2 + √(tr²/4 − det) is smooth, and at a stationary point
 * σ = det′/tr′ = (c − 2Pq)/S; substituting into the characteristic equation gives
 *   −P(Du − Dv)² q² + 2P(S·T₀ − 2c) q + (c² − S·T₀·c + S²·Δ₀) = 0
 * (derived here). Its roots are the only candidates for a local maximum of σ_max at k > 0: each
 * is kept when it lies on the real, larger branch (σ_max(q) = (c − 2Pq)/S) and is a maximum.
 * No wavenumber grid, no allocation: k* is exact, and a band narrower than any grid step is found.
 */
import { CLASS_HOPF, CLASS_PEAK, CLASS_UNSTABLE_K0 } from "./classes";

// Local copies: a module's exported constant may be read through an accessor in the inner loop.
const PEAK = CLASS_PEAK,
  HOPF = CLASS_HOPF,
  UNSTABLE_K0 = CLASS_UNSTABLE_K0;

export interface Cell2x2Peak {
  k: number;
  sigma: number;
}

/** Largest real part of the eigenvalues of J − q·diag(Du, Dv). */
export function sigmaMax2x2(fu: number, fv: number, gu: number, gv: number, Du: number, Dv: number, q: number): number {
  const a = fu - q * Du,
    d = gv - q * Dv;
  const half = 0.5 * (a + d);
  const disc = half * half - (a * d - fv * gu);
  return disc >= 0 ? half + Math.sqrt(disc) : half;
}

/**
 * Flags of the cell (growth peak at k > 0 / Hopf / unstable at k = 0) and the fastest k > 0
 * peak in `peak` (k = NaN when none). `J` = [f_u, f_v, g_u, g_v], `Du`, `Dv` > 0.
 */
export function analyseCell2x2(J: ArrayLike<number>, Du: number, Dv: number, peak: Cell2x2Peak): number {
  const fu = J[0],
    fv = J[1],
    gu = J[2],
    gv = J[3];
  const norm = Math.sqrt(fu * fu + fv * fv + gu * gu + gv * gv) || 1;
  const tol = 1e-9 * norm,
    imTol = 1e-7 * norm;
  const T0 = fu + gv,
    det0 = fu * gv - fv * gu;
  let flags = 0;
  const disc0 = 0.25 * T0 * T0 - det0;
  if (disc0 >= 0) {
    if (0.5 * T0 + Math.sqrt(disc0) > tol) flags |= UNSTABLE_K0;
  } else if (0.5 * T0 > tol) flags |= Math.sqrt(-disc0) > imTol ? HOPF : UNSTABLE_K0;
  peak.k = NaN;
  peak.sigma = -Infinity;
  const S = Du + Dv,
    P = Du * Dv,
    c = Dv * fu + Du * gv;
  const A = -P * (Du - Dv) * (Du - Dv),
    B = 2 * P * (S * T0 - 2 * c),
    C = c * c - S * T0 * c + S * S * det0;
  let q1 = NaN,
    q2 = NaN;
  if (Math.abs(A) > 1e-14 * Math.abs(B)) {
    const d = B * B - 4 * A * C;
    if (d >= 0) {
      // The numerically stable pair of roots (no cancellation between −B and √d).
      const t = -0.5 * (B + (B >= 0 ? Math.sqrt(d) : -Math.sqrt(d)));
      q1 = t / A;
      q2 = t !== 0 ? C / t : NaN;
    }
  } else if (B !== 0) q1 = -C / B;
  considerRoot(q1, fu, fv, gu, gv, Du, Dv, S, P, c, tol, peak);
  considerRoot(q2, fu, fv, gu, gv, Du, Dv, S, P, c, tol, peak);
  if (peak.k > 0) flags |= PEAK;
  return flags;
}

/** Keeps root q as the peak when it is a growing local maximum of σ_max on the real branch and beats the current one. */
function considerRoot(
  q: number,
  fu: number,
  fv: number,
  gu: number,
  gv: number,
  Du: number,
  Dv: number,
  S: number,
  P: number,
  c: number,
  tol: number,
  peak: Cell2x2Peak,
): void {
  if (!(q > 0) || !Number.isFinite(q)) return;
  const s = sigmaMax2x2(fu, fv, gu, gv, Du, Dv, q);
  if (!(s > tol) || s <= peak.sigma) return;
  // On the larger real branch the stationary value is (c − 2Pq)/S; a root of the other branch (or of the squaring) is not.
  const onBranch = (c - 2 * P * q) / S;
  if (!(Math.abs(s - onBranch) <= 1e-7 * Math.max(Math.abs(s), Math.abs(onBranch), tol))) return;
  const h = 1e-4 * q;
  if (!(s >= sigmaMax2x2(fu, fv, gu, gv, Du, Dv, q - h) && s >= sigmaMax2x2(fu, fv, gu, gv, Du, Dv, q + h))) return;
  peak.k = Math.sqrt(q);
  peak.sigma = s;
}
