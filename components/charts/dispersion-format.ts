/** Number formatting for kinetics pages and plots: 4 significant figures, exponents for very small or large values. */
export function formatNumber(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "—";
  if (x === 0) return "0";
  const a = Math.abs(x);
  if (a >= 1e5 || a < 1e-3) return x.toExponential(digits - 1).replace("e+", "e");
  return Number(x.toPrecision(digits)).toString();
}

/** Unit strings of a kinetics' model or physical quantities. */
export interface AxisUnits {
  /** Wavenumber unit, e.g. "1/µm" or "1/model length". */
  k: string;
  /** Growth-rate unit, e.g. "1/s" or "1/model time". */
  sigma: string;
  /** Length unit, e.g. "µm" or "model length". */
  length: string;
}

/** Units and factors that turn model numbers physical: k/ℓ, σ/τ, λ·ℓ (SCIENCE.md §3). */
export function unitsFor(
  lengthScaleUm: number | null,
  timeScaleS: number | null,
): AxisUnits & { kFactor: number; sigmaFactor: number; lengthFactor: number } {
  return {
    k: lengthScaleUm ? "1/µm" : "1/model length",
    sigma: timeScaleS ? "1/s" : "1/model time",
    length: lengthScaleUm ? "µm" : "model length",
    kFactor: lengthScaleUm ? 1 / lengthScaleUm : 1,
    sigmaFactor: timeScaleS ? 1 / timeScaleS : 1,
    lengthFactor: lengthScaleUm ?? 1,
  };
}
