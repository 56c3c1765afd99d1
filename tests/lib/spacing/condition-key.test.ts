/** Conditions typed by people match without regard to case, Unicode form and spaces (common practice, no source). */
import { describe, expect, it } from "vitest";
import { collectConditionSpellings, conditionKey } from "@/lib/spacing";

describe("condition names", () => {
  it("match without regard to case, surrounding and repeated spaces and Unicode normal form", () => {
    expect(conditionKey("Kontrolle")).toBe(conditionKey(" kontrolle "));
    expect(conditionKey("inhibitor  5 µM")).toBe(conditionKey("Inhibitor 5 µM"));
    // "é" as one code point (NFC) and as e + combining acute (NFD) are one name.
    expect(conditionKey("traité")).toBe(conditionKey("traite\u0301"));
    expect(conditionKey("control")).not.toBe(conditionKey("controls"));
  });

  it("shows the first spelling and lists the merged ones", () => {
    const s = collectConditionSpellings(["Kontrolle", "kontrolle", "treated", "Kontrolle"]);
    expect(s.displayOf("KONTROLLE")).toBe("Kontrolle");
    expect(s.displayOf("treated")).toBe("treated");
    expect(s.merged()).toEqual([["Kontrolle", "kontrolle"]]);
  });
});
