/**
 * An axis range that keeps the data readable when an interval is very wide (a 95 % CI of two
 * replicates is ±12.7 standard errors): the range covers every value and mean, and each interval
 * may widen it by at most the data's own span on either side. Interval ends beyond the range are
 * drawn at the axis edge and marked with their value, never outside the axes.
 */
export interface AxisRange {
  lo: number;
  hi: number;
}

export interface ClippedInterval {
  lo: number;
  hi: number;
  /** The true end when it lies below / above the axis (to label, e.g. "↓ 3.2 µm"), else null. */
  beyondLow: number | null;
  beyondHigh: number | null;
}

/** How far past the values an interval may stretch the axis, in spans of the values (common practice, no source). */
const MAX_STRETCH = 1;

export function axisRangeFor(
  values: number[],
  intervals: Array<[number, number] | null>,
  padFraction = 0.12,
): AxisRange {
  const finite = values.filter(Number.isFinite);
  if (!finite.length) return { lo: 0, hi: 1 };
  let lo = Math.min(...finite),
    hi = Math.max(...finite);
  const span = hi - lo || Math.abs(hi) * 0.1 || 1;
  const floor = lo - MAX_STRETCH * span,
    ceiling = hi + MAX_STRETCH * span;
  for (const ci of intervals) {
    if (!ci) continue;
    lo = Math.min(lo, Math.max(ci[0], floor));
    hi = Math.max(hi, Math.min(ci[1], ceiling));
  }
  const pad = (hi - lo || span) * padFraction;
  return { lo: lo - pad, hi: hi + pad };
}

export function clipInterval([a, b]: [number, number], range: AxisRange): ClippedInterval {
  return {
    lo: Math.max(a, range.lo),
    hi: Math.min(b, range.hi),
    beyondLow: a < range.lo ? a : null,
    beyondHigh: b > range.hi ? b : null,
  };
}
