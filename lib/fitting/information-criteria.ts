/**
 * Small-sample Akaike information criterion with known measurement uncertainties, where
 * −2 ln L = χ² + const: AICc = χ² + 2p + 2p(p + 1)/(n − p − 1) (Burnham & Anderson 2002, §2.4).
 * Undefined (null) when n − p − 1 ≤ 0.
 */
export function computeAicc(chiSquare: number, n: number, p: number): number | null {
  if (n - p - 1 <= 0) return null;
  return chiSquare + 2 * p + (2 * p * (p + 1)) / (n - p - 1);
}

/** Bayesian information criterion with known uncertainties: BIC = χ² + p·ln n (Schwarz 1978). */
export function computeBic(chiSquare: number, n: number, p: number): number {
  return chiSquare + p * Math.log(n);
}

/**
 * Akaike weights wᵢ = exp(−Δᵢ/2) / Σⱼ exp(−Δⱼ/2), Δᵢ = AICcᵢ − min AICc (Burnham & Anderson
 * 2002, §2.9): the relative support for each model within the set. Entries that are null get a
 * null weight and do not enter the sum.
 */
export function computeAkaikeWeights(criteria: readonly (number | null)[]): (number | null)[] {
  const finite = criteria.filter((c): c is number => c !== null && Number.isFinite(c));
  if (finite.length === 0) return criteria.map(() => null);
  const best = Math.min(...finite);
  const raw = criteria.map((c) => (c !== null && Number.isFinite(c) ? Math.exp(-(c - best) / 2) : null));
  const total = raw.reduce<number>((s, w) => s + (w ?? 0), 0);
  return raw.map((w) => (w === null ? null : w / total));
}
