/**
 * Adaptive time steps for the ETD2RK scheme (schemes.ts): the local error estimate of the
 * embedded pair ETD2RK / ETD1 and the standard step-size controller of Hairer E., Nørsett S.P. &
 * Wanner G. (1993) Solving Ordinary Differential Equations I, 2nd ed., §II.4 (eqs. 4.10–4.13):
 *
 *   sc_i = atol_s + rtol · max(|c_i|, |c⁺_i|),   err = √( (1/N) Σ ((c⁺_i − a_i) / sc_i)² )
 *   accept when err ≤ 1;   h_new = h · min(facMax, max(facMin, fac · err^(−1/(q+1))))
 *
 * with q = 1 (the lower order of the pair), fac = 0.9, facMin = 0.2, facMax = 5 (1 right after a
 * rejection, as HNW advise). After an accepted step that followed an accepted step, the
 * proportional–integral form of Gustafsson K. (1991) BIT 31:482 (HNW II, §IV.2, eq. (2.43c)),
 * h_new = h · fac · err^(−0.7/2) · err_prev^(0.4/2), replaces the power law: explicit reaction
 * terms bound the step by stability once the pattern has settled, and there the plain rule
 * oscillates between too long (rejected) and too short steps. atol_s = rtol · RMS(c_s) of the species at the start of the step, so
 * the tolerance is relative and unit-free (a choice, no source).
 */
import type { SchemeName, SpeciesCoefficients } from "./schemes";
import { fillSchemeCoefficients } from "./schemes";

export const STEP_CONTROL = {
  /** Safety factor fac of HNW (4.13). */
  safety: 0.9,
  facMin: 0.2,
  facMax: 5,
  /** Exponent 1/(q + 1) with q = 1, the order of the embedded ETD1 solution. */
  exponent: 0.5,
  /** PI exponents β1 = 0.7/(q + 1), β2 = 0.4/(q + 1) (Gustafsson 1991). */
  piCurrent: 0.35,
  piPrevious: 0.2,
  /** Steps are rounded down to 2^(j/8) so φ-functions can be cached per step size. */
  ladderPerOctave: 8,
  /** At most this many step sizes' coefficients are kept. */
  cacheEntries: 8,
  /** Default tolerance rtol. */
  tolerance: 1e-3,
} as const;

/** The rule as recorded in a run's result and provenance. */
export const STEP_RULE_TEXT =
  "ETD2RK with embedded ETD1 (Cox & Matthews 2002); error = RMS over cells and species of (c⁺ − c_ETD1)/(rtol·(RMS(c_s) + max(|c|, |c⁺|))), step accepted when ≤ 1; next step h·min(5, max(0.2, 0.9·err^(−1/2))) (Hairer, Nørsett & Wanner, Solving ODEs I, §II.4), or after two accepted steps h·0.9·err^(−0.35)·err_prev^(0.2) (PI control, Gustafsson 1991), rounded down to 2^(j/8)";

/**
 * Weighted RMS norm of the local error c⁺ − a over every species (HNW (4.11)); `start` is c at
 * the beginning of the step. NaN when any value is not finite.
 */
export function computeStepError(
  start: readonly Float64Array[],
  trial: readonly Float64Array[],
  embedded: readonly Float64Array[],
  tolerance: number,
): number {
  let sum = 0,
    count = 0;
  for (let s = 0; s < start.length; s++) {
    const c = start[s],
      t = trial[s],
      a = embedded[s];
    let sq = 0;
    for (let i = 0; i < c.length; i++) sq += c[i] * c[i];
    const atol = tolerance * Math.sqrt(sq / c.length);
    for (let i = 0; i < c.length; i++) {
      const ci = c[i] < 0 ? -c[i] : c[i],
        ti = t[i] < 0 ? -t[i] : t[i];
      const sc = atol + tolerance * (ci > ti ? ci : ti);
      const e = (t[i] - a[i]) / (sc > 0 ? sc : tolerance);
      sum += e * e;
    }
    count += c.length;
  }
  const err = Math.sqrt(sum / count);
  return Number.isFinite(err) ? err : NaN;
}

/**
 * The next step size after a step of `stepS` with error `err`: HNW (4.13) after a rejection or
 * the first step (`previousErr` null), the PI rule when the previous step was accepted too.
 */
export function proposeStep(
  stepS: number,
  err: number,
  afterRejection: boolean,
  previousErr: number | null = null,
): number {
  if (!(err >= 0)) return stepS * STEP_CONTROL.facMin; // NaN or ±∞: the trial blew up
  const facMax = afterRejection ? 1 : STEP_CONTROL.facMax;
  const e = Math.max(err, 1e-10);
  const factor =
    previousErr === null || afterRejection
      ? STEP_CONTROL.safety * Math.pow(e, -STEP_CONTROL.exponent)
      : STEP_CONTROL.safety *
        Math.pow(e, -STEP_CONTROL.piCurrent) *
        Math.pow(Math.max(previousErr, 1e-4), STEP_CONTROL.piPrevious);
  return stepS * Math.min(facMax, Math.max(STEP_CONTROL.facMin, factor));
}

/** Rounds a step down to the ladder 2^(j/8), so the φ-functions of few step sizes are ever needed. */
export function roundStepDown(stepS: number): number {
  const j = Math.floor(Math.log2(stepS) * STEP_CONTROL.ladderPerOctave + 1e-9);
  return Math.pow(2, j / STEP_CONTROL.ladderPerOctave);
}

/**
 * The scheme's per-mode multipliers by step size: filled on first use, then copied into the
 * arrays the executor reads (shared with worker threads), least recently used dropped first.
 */
export function createCoefficientCache(
  scheme: SchemeName,
  k2PerUm2: Float64Array,
  diffusion: readonly number[],
  names: readonly (keyof SpeciesCoefficients)[],
  targets: SpeciesCoefficients[],
): { select(stepS: number): void } {
  const entries = new Map<number, SpeciesCoefficients[]>();
  let current = NaN;
  const fill = (stepS: number): SpeciesCoefficients[] =>
    diffusion.map((d) => {
      const c: SpeciesCoefficients = {};
      for (const name of names) c[name] = new Float64Array(k2PerUm2.length);
      fillSchemeCoefficients(scheme, k2PerUm2, d, stepS, c);
      return c;
    });
  return {
    select(stepS) {
      if (stepS === current) return;
      let entry = entries.get(stepS);
      if (entry) entries.delete(stepS);
      else entry = fill(stepS);
      entries.set(stepS, entry); // most recently used last
      if (entries.size > STEP_CONTROL.cacheEntries) entries.delete(entries.keys().next().value!);
      targets.forEach((t, s) => {
        for (const name of names) t[name]!.set(entry[s][name]!);
      });
      current = stepS;
    },
  };
}
