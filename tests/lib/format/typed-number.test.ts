/**
 * Numbers as people type them: a decimal comma is read where it can mean nothing else (one
 * comma, no point, digits on both sides, not a possible thousands group); anything else with a
 * comma is refused with a message that says to use a point. Check values: the decimal sign
 * conventions of ISO 80000-1 §7.3.1 (comma or point on the line); "1,000" as one thousand is the
 * English thousands separator (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { optionalTypedNumber, parseTypedNumber, typedNumberOrText } from "@/lib/format/typed-number";

const value = (text: string) => {
  const r = parseTypedNumber(text);
  return r.ok ? r.value : null;
};
const message = (text: string) => {
  const r = parseTypedNumber(text);
  return r.ok ? null : r.message;
};

describe("parseTypedNumber", () => {
  it("reads plain numbers with a point, exponents and a typographic minus", () => {
    expect(value("0.65")).toBe(0.65);
    expect(value(" 12 ")).toBe(12);
    expect(value(".5")).toBe(0.5);
    expect(value("1e-3")).toBe(0.001);
    expect(value("\u22122.5")).toBe(-2.5);
  });

  it("reads an unambiguous decimal comma", () => {
    expect(value("0,65")).toBe(0.65);
    expect(value("12,5")).toBe(12.5);
    expect(value("-3,25")).toBe(-3.25);
    expect(value("0,650")).toBe(0.65);
    expect(value("6,5e-3")).toBe(0.0065);
  });

  it("refuses a comma that could be a thousands separator, or more than one, saying to use a point", () => {
    expect(message("1,000")).toBe(
      "“1,000” could be a thousands separator or a decimal comma; use a point for decimals (e.g. 0.65)",
    );
    expect(message("1.234,5")).toBe("“1.234,5” is not one number; use a point for decimals (e.g. 0.65)");
    expect(message("1,2,3")).toBe("“1,2,3” is not one number; use a point for decimals (e.g. 0.65)");
    expect(message(",5")).toBe("“,5” is not one number; use a point for decimals (e.g. 0.65)");
  });

  it("refuses what is no number, and an empty field", () => {
    expect(message("abc")).toBe("“abc” is not a number");
    expect(message("0x10")).toBe("“0x10” is not a number");
    expect(message("Infinity")).toBe("“Infinity” is not a number");
    expect(message("1e999")).toBe("“1e999” is too large");
    expect(message("  ")).toBe("enter a number");
  });

  it("for a JSON body: a number, or the text itself so the server names the field", () => {
    expect(typedNumberOrText("0,65")).toBe(0.65);
    expect(typedNumberOrText("1,000")).toBe("1,000");
    expect(optionalTypedNumber(" ")).toBeUndefined();
    expect(optionalTypedNumber("2")).toBe(2);
  });
});
