import { jStat } from "jstat";
import { mean, sampleVariance } from "simple-statistics";
import { SpacingError } from "./errors";

export interface WelchResult {
  /** mean(a) − mean(b), units of the input. */
  meanDifference: number;
  t: number;
  /** Welch–Satterthwaite degrees of freedom. */
  df: number;
  /** Two-sided p-value. */
  pValue: number;
  /** 95 % CI of the difference of means. */
  ci95: [number, number];
  /** Hedges' g: Cohen's d on the pooled SD times J = 1 − 3/(4(n₁+n₂) − 9) (Hedges 1981, J. Educ. Stat. 6:107). */
  hedgesG: number;
}

/** Welch's unequal-variance t-test (Welch 1947, Biometrika 34:28) with Hedges' g. */
export function welchTTest(a: ArrayLike<number>, b: ArrayLike<number>): WelchResult {
  const x = Array.from(a),
    y = Array.from(b);
  if (x.length < 2 || y.length < 2)
    throw new SpacingError(`Each group needs at least 2 values (got ${x.length} and ${y.length}).`, "groups");
  const [n1, n2] = [x.length, y.length];
  const [v1, v2] = [sampleVariance(x), sampleVariance(y)];
  const d = mean(x) - mean(y);
  const se2 = v1 / n1 + v2 / n2;
  if (!(se2 > 0)) throw new SpacingError("Both groups have zero variance, so the t statistic is undefined.", "groups");
  const se = Math.sqrt(se2);
  const t = d / se;
  const df = (se2 * se2) / ((v1 / n1) ** 2 / (n1 - 1) + (v2 / n2) ** 2 / (n2 - 1));
  const pValue = 2 * (1 - jStat.studentt.cdf(Math.abs(t), df));
  const q = jStat.studentt.inv(0.975, df);
  const pooled = Math.sqrt(((n1 - 1) * v1 + (n2 - 1) * v2) / (n1 + n2 - 2));
  const hedgesG = pooled > 0 ? (d / pooled) * (1 - 3 / (4 * (n1 + n2) - 9)) : 0;
  return { meanDifference: d, t, df, pValue, ci95: [d - q * se, d + q * se], hedgesG };
}
