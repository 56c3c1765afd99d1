/**
 * Fast path of a Turing-map cell for two species with diagonal D: σ_max(k) on the k grid
 * from the 2×2 closed form with all coefficients in locals, and k* of the real branch in
 * closed form. Along the real branch σ(q), q = k², solves σ² − tr(q)σ + det(q) = 0; at a
 * stationary point σ = det′/tr′ = (c − 2Pq)/S, and substituting gives
 *   −P(Du − Dv)² q² + 2P(S·T₀ − 2c) q + (c² − S·T₀·c + S²·Δ₀) = 0,
 * with S = Du + Dv, P = Du·Dv, c = Dv f_u + Du g_v, T₀ = tr J, Δ₀ = det J (derived here from
 * the characteristic polynomial of J − qD, Murray 2003 §2.3). Allocation-free.
 */
import { CLASS_HOPF, CLASS_PEAK, CLASS_UNSTABLE_K0 } from "./classes";
import { maximiseGolden } from "./roots";

export interface Cell2x2Peak {
  k: number;
  sigma: number;
}

function sigma2(fu: number, fv: number, gu: number, gv: number, Du: number, Dv: number, q: number): number {
  const a = fu - q * Du, d = gv - q * Dv;
  const half = 0.5 * (a + d);
  const disc = half * half - (a * d - fv * gu);
  return disc >= 0 ? half + Math.sqrt(disc) : half;
}

/**
 * Flags of the cell (Turing / Hopf / unstable at k = 0) and the fastest k > 0 peak in `peak`
 * (k = NaN when none). `J` = [f_u, f_v, g_u, g_v], `Du`, `Dv` > 0, `grid` wavenumbers on [0, kMax].
 */
export function analyseCell2x2(J: ArrayLike<number>, Du: number, Dv: number, kMax: number, grid: number, peak: Cell2x2Peak): number {
  const fu = J[0], fv = J[1], gu = J[2], gv = J[3];
  const norm = Math.sqrt(fu * fu + fv * fv + gu * gu + gv * gv) || 1;
  const tol = 1e-9 * norm, imTol = 1e-7 * norm;
  const T0 = fu + gv, det0 = fu * gv - fv * gu;
  let flags = 0;
  const disc0 = 0.25 * T0 * T0 - det0;
  if (disc0 >= 0) {
    if (0.5 * T0 + Math.sqrt(disc0) > tol) flags |= CLASS_UNSTABLE_K0;
  } else if (0.5 * T0 > tol) flags |= Math.sqrt(-disc0) > imTol ? CLASS_HOPF : CLASS_UNSTABLE_K0;
  peak.k = NaN;
  peak.sigma = -Infinity;
  const h = kMax / (grid - 1);
  let s2 = sigma2(fu, fv, gu, gv, Du, Dv, 0), s1 = sigma2(fu, fv, gu, gv, Du, Dv, h * h);
  let bestI = -1, best = -Infinity;
  for (let i = 2; i < grid; i++) {
    const k = i * h;
    const s = sigma2(fu, fv, gu, gv, Du, Dv, k * k);
    if (s1 >= s2 && s1 > s && s1 > best) {
      best = s1;
      bestI = i - 1;
    }
    s2 = s1;
    s1 = s;
  }
  // The k minimising det(k) is checked too, so a band narrower than the grid step is not missed.
  const S = Du + Dv, P = Du * Dv, c = Dv * fu + Du * gv;
  let lo: number, hi: number;
  if (bestI > 0) {
    lo = (bestI - 1) * h;
    hi = (bestI + 1) * h;
  } else if (c > 0) {
    const km = Math.sqrt(c / (2 * P));
    if (!(km < kMax) || !(sigma2(fu, fv, gu, gv, Du, Dv, km * km) > tol)) return flags;
    lo = Math.max(0, km - h);
    hi = Math.min(kMax, km + h);
  } else return flags;
  // Closed-form k* of the real branch; golden section when no root falls in the bracket.
  const A = -P * (Du - Dv) * (Du - Dv), B = 2 * P * (S * T0 - 2 * c), C = c * c - S * T0 * c + S * S * det0;
  let q = NaN;
  const qLo = lo * lo, qHi = hi * hi;
  if (Math.abs(A) > 1e-14 * Math.abs(B)) {
    const d = B * B - 4 * A * C;
    if (d >= 0) {
      const r = Math.sqrt(d), q1 = (-B + r) / (2 * A), q2 = (-B - r) / (2 * A);
      if (q1 >= qLo && q1 <= qHi) q = q1;
      else if (q2 >= qLo && q2 <= qHi) q = q2;
    }
  } else if (B !== 0) {
    const q1 = -C / B;
    if (q1 >= qLo && q1 <= qHi) q = q1;
  }
  let k: number;
  if (q > 0) k = Math.sqrt(q);
  else k = maximiseGolden((x) => sigma2(fu, fv, gu, gv, Du, Dv, x * x), lo, hi, 1e-10 * hi);
  const sk = sigma2(fu, fv, gu, gv, Du, Dv, k * k);
  if (sk > tol) {
    flags |= CLASS_PEAK;
    peak.k = k;
    peak.sigma = sk;
  }
  return flags;
}
