/** The tolerance matchers themselves: each passes inside its tolerance and fails just outside it. */
import { describe, expect, it } from "vitest";

describe("numeric tolerance matchers (registered by tests/support/register-matchers.ts)", () => {
  it("toBeWithinRelative: strictly less than rel·|expected|, equal values always pass", () => {
    // Check values are round numbers chosen by hand (common practice, no source).
    expect(100.9).toBeWithinRelative(100, 0.01);
    expect(() => expect(101.5).toBeWithinRelative(100, 0.01)).toThrow(/within relative 0.01 of 100/);
    expect(() => expect(null).toBeWithinRelative(8, 0.01)).toThrow();
    expect(-2.01).toBeWithinRelative(-2, 0.01);
    expect(NaN).toBeWithinRelative(NaN, 1e-9);
    expect(0).toBeWithinRelative(-0, 1e-9);
    expect(() => expect(1e-30).toBeWithinRelative(0, 1e-9)).toThrow();
    expect(101.5).not.toBeWithinRelative(100, 0.01);
  });

  it("toBeWithinAbsolute: strictly less than abs", () => {
    expect(8.19).toBeWithinAbsolute(8, 0.2);
    expect(() => expect(8.3).toBeWithinAbsolute(8, 0.2)).toThrow(/within 0.2 of 8/);
    expect(() => expect("8").toBeWithinAbsolute(8, 0.2)).toThrow();
  });

  it("toBeWithinScaled: absolute below 1, relative above", () => {
    expect(1e-10).toBeWithinScaled(0, 1e-9);
    expect(() => expect(2e-9).toBeWithinScaled(0, 1e-9)).toThrow();
    expect(1000 + 5e-7).toBeWithinScaled(1000, 1e-9);
    expect(() => expect(1000 + 2e-6).toBeWithinScaled(1000, 1e-9)).toThrow();
  });

  it("work inside asymmetric matchers too", () => {
    expect({ wavelengthUm: 10.05 }).toEqual({ wavelengthUm: expect.toBeWithinRelative(10, 0.01) });
  });
});
