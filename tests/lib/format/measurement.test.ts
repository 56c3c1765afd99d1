/**
 * Numbers printed the way a paper prints them. Rule: the uncertainty to two significant digits, the value
 * to the same decimal place (GUM, JCGM 100:2008 §7.2.6). Expected strings worked out by hand.
 */
import { describe, expect, it } from "vitest";
import { formatMeasurement, formatPixelSize, formatPlain, formatPlusMinus } from "@/lib/format/measurement";

describe("a value with its uncertainty", () => {
  it.each([
    [15.40312, 0.0123, "15.403", "0.012"],
    [15.403, 0.00066, "15.40300", "0.00066"],
    [1234.56, 12.3, "1235", "12"],
    [182345, 1234, "182300", "1200"],
    [0.001234, 0.000041, "0.001234", "0.000041"],
    [32.0039, 0.0099, "32.0039", "0.0099"],
  ])("%f ± %f → %s ± %s", (v, u, vs, us) => {
    expect(formatMeasurement(v, u)).toEqual({ value: vs, uncertainty: us });
  });

  it("a unit follows; no uncertainty gives 4 significant digits", () => {
    expect(formatPlusMinus(15.40312, 0.0123, "µm")).toBe("15.403 ± 0.012 µm");
    expect(formatPlusMinus(15.40312, null, "µm")).toBe("15.4 µm");
  });
});

describe("plain numbers", () => {
  it.each([
    [182345, 3, "182345"],
    [0.00066, 2, "0.00066"],
    [15.4, 4, "15.4"],
    [2.5e-6, 2, "2.5e-6"],
    [3.2e8, 2, "3.2e+8"],
  ])("%f to %i digits → %s", (v, d, s) => {
    expect(formatPlain(v, d)).toBe(s);
  });
});

describe("pixel sizes as the metadata holds them", () => {
  it.each([
    [1e4 / 15384.615384615385, "0.65"], // 15 384.615… px/cm, a converted 0.65 µm (float noise dropped)
    [1e4 / 15385, "0.649984"], // 15 385 px/cm as stored: six digits kept
    [0.325, "0.325"], // OME PhysicalSizeX="0.325"
    [2, "2"],
  ])("%f µm → %s", (um, shown) => {
    expect(formatPixelSize(um)).toBe(shown);
  });
});
