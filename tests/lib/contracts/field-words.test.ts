/**
 * Messages about a field name it in the form's words: the JSON name a schema or the science core
 * begins with becomes the label, JSON names said in passing become words, and a message that
 * already begins in plain words is kept (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { describeFieldMessage, formatFieldPath, renameFieldInMessage } from "@/lib/contracts/field-words";

describe("describeFieldMessage", () => {
  it("replaces the JSON name a message begins with by the label", () => {
    expect(describeFieldMessage(["models", 1, "lengthScaleUm"], "lengthScaleUm (µm) must be above 0")).toBe(
      "Length scale of the second kinetics (µm) must be above 0",
    );
    expect(describeFieldMessage(["endTimeS"], "endTimeS must be above 0")).toBe("Simulated time must be above 0");
    expect(
      describeFieldMessage("definition.reactions[1]", "definition.reactions[1] does not parse: x", {
        species: ["A", "B"],
      }),
    ).toBe("Equation for dB/dt does not parse: x");
    expect(describeFieldMessage("pixelSizeUm", "pixelSizeUm: pixel size must be above 0 µm/px")).toBe(
      "Pixel size (µm per pixel) must be above 0 µm/px",
    );
  });

  it("puts the label before a message that does not name its field", () => {
    expect(describeFieldMessage(["definition", "species"], "Too small: expected array to have >=2 items")).toBe(
      "Species: Too small: expected array to have >=2 items",
    );
  });

  it("says JSON names mentioned in passing as words", () => {
    expect(
      describeFieldMessage("data[0].uncertaintyUm", "data[0].uncertaintyUm: a typed measurement needs uncertaintyUm"),
    ).toBe("Uncertainty of measurement 1 (µm): a typed measurement needs uncertainty");
  });

  it("leaves a message in plain words as it is when only renaming", () => {
    expect(renameFieldInMessage("projection", "Plane 3 does not exist: this file has 2 planes")).toBe(
      "Plane 3 does not exist: this file has 2 planes",
    );
    expect(renameFieldInMessage("unknownField", "unknownField: bad")).toBe("unknownField: bad");
  });

  it("writes the machine field with brackets", () => {
    expect(formatFieldPath(["models", 1, "lengthScaleUm"])).toBe("models[1].lengthScaleUm");
  });
});
