import { describe, expect, it } from "vitest";
import { axisRangeFor, clipInterval } from "@/components/charts/clip-interval";

describe("axisRangeFor", () => {
  it("covers narrow intervals whole, with the padding around them", () => {
    // Values 40…50, CI 38…52 inside one span: range = 38…52 ± 12 % of 14 (arithmetic, no source).
    const r = axisRangeFor([40, 50], [[38, 52]]);
    expect(r.lo).toBeCloseTo(38 - 0.12 * 14, 12);
    expect(r.hi).toBeCloseTo(52 + 0.12 * 14, 12);
  });

  it("lets a very wide interval stretch the axis by at most the values' span on each side", () => {
    // Values 40…50 (span 10), CI −300…412: axis 30…60 before padding (common practice, no source).
    const r = axisRangeFor([40, 50], [[-300, 412]], 0);
    expect(r).toEqual({ lo: 30, hi: 60 });
  });
});

describe("clipInterval", () => {
  it("keeps an interval inside the axis and names the ends it cut", () => {
    expect(clipInterval([-300, 412], { lo: 30, hi: 60 })).toEqual({ lo: 30, hi: 60, beyondLow: -300, beyondHigh: 412 });
    expect(clipInterval([35, 55], { lo: 30, hi: 60 })).toEqual({ lo: 35, hi: 55, beyondLow: null, beyondHigh: null });
  });
});
