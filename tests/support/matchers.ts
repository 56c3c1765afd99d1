/**
 * Numeric tolerance matchers, registered once for every test file by
 * `tests/support/register-matchers.ts` (a vitest setup file). Each takes the tolerance as the
 * test states it, so the tolerance stays beside its source in the test.
 */
import type { MatcherState } from "vitest";

interface MatcherResult {
  pass: boolean;
  message: () => string;
}

/** Equal values (NaN with NaN, ±0 with ±0 included) meet every tolerance. */
function sameValue(received: number, expected: number): boolean {
  return received === expected || (Number.isNaN(received) && Number.isNaN(expected));
}

function isNumber(value: unknown): value is number {
  return typeof value === "number";
}

function report(this: MatcherState, pass: boolean, received: unknown, rule: string): MatcherResult {
  const got = this.utils.printReceived(received);
  return {
    pass,
    message: () => (pass ? `expected ${got} not to be ${rule}` : `expected ${got} to be ${rule}`),
  };
}

export const numericMatchers = {
  /** |received − expected| < rel·|expected| (strictly), or received equals expected. */
  toBeWithinRelative(this: MatcherState, received: unknown, expected: number, rel: number): MatcherResult {
    const pass =
      isNumber(received) && (sameValue(received, expected) || Math.abs(received - expected) < rel * Math.abs(expected));
    const error = isNumber(received) ? Math.abs(received - expected) / Math.abs(expected) : NaN;
    return report.call(this, pass, received, `within relative ${rel} of ${expected} (relative error ${error})`);
  },

  /** |received − expected| < abs (strictly), or received equals expected. */
  toBeWithinAbsolute(this: MatcherState, received: unknown, expected: number, abs: number): MatcherResult {
    const pass = isNumber(received) && (sameValue(received, expected) || Math.abs(received - expected) < abs);
    const error = isNumber(received) ? Math.abs(received - expected) : NaN;
    return report.call(this, pass, received, `within ${abs} of ${expected} (difference ${error})`);
  },

  /**
   * |received − expected| ≤ tol·max(1, |received|, |expected|): relative for values above 1,
   * absolute below, so values near zero do not demand impossible relative precision.
   */
  toBeWithinScaled(this: MatcherState, received: unknown, expected: number, tol: number): MatcherResult {
    const pass =
      isNumber(received) &&
      (sameValue(received, expected) ||
        Math.abs(received - expected) <= tol * Math.max(1, Math.abs(received), Math.abs(expected)));
    return report.call(this, pass, received, `within ${tol}·max(1, |value|) of ${expected}`);
  },
};

interface NumericMatchers<R = unknown> {
  /** |received − expected| < rel·|expected|, or equal (NaN = NaN). */
  toBeWithinRelative(expected: number, rel: number): R;
  /** |received − expected| < abs, or equal (NaN = NaN). */
  toBeWithinAbsolute(expected: number, abs: number): R;
  /** |received − expected| ≤ tol·max(1, |received|, |expected|). */
  toBeWithinScaled(expected: number, tol: number): R;
}

declare module "vitest" {
  // Declaration merging into vitest's own interface (its documented way to type custom matchers).
  // eslint-disable-next-line @typescript-eslint/no-empty-object-type
  interface Matchers<T> extends NumericMatchers<T> {}
  // eslint-disable-next-line @typescript-eslint/no-empty-object-type
  interface AsymmetricMatchersContaining extends NumericMatchers {}
}
