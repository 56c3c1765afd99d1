import { jStat } from "jstat";
import { mean, median, sampleStandardDeviation } from "simple-statistics";
import { SpacingError } from "./errors";

/** Descriptive statistics of a sample (units of the input). */
export interface Summary {
  n: number;
  mean: number;
  /** Sample SD, n − 1 denominator. */
  sd: number;
  /** SD/√n. */
  sem: number;
  /** SD/mean (dimensionless). */
  cv: number;
  median: number;
  min: number;
  max: number;
  /** 95 % CI of the mean: mean ± t₀.₉₇₅,ₙ₋₁·SEM (Student 1908; t quantile from jstat). */
  ci95: [number, number];
}

export function summarize(values: ArrayLike<number>): Summary {
  const v = Array.from(values);
  if (v.length < 2) throw new SpacingError(`At least 2 values are needed for a summary (got ${v.length}).`, "values");
  const n = v.length;
  const m = mean(v);
  const sd = sampleStandardDeviation(v);
  const sem = sd / Math.sqrt(n);
  const t = jStat.studentt.inv(0.975, n - 1);
  let min = Infinity,
    max = -Infinity;
  for (const x of v) {
    if (x < min) min = x;
    if (x > max) max = x;
  }
  return { n, mean: m, sd, sem, cv: sd / m, median: median(v), min, max, ci95: [m - t * sem, m + t * sem] };
}
