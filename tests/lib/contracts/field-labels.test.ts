/**
 * Every field of the forms' request bodies has words a biologist reads: walking each schema,
 * a path without a label in lib/contracts/field-labels.ts fails here. Labels carry no JSON names
 * (no camelCase, no dotted paths, no brackets) and count positions from 1.
 */
import { describe, expect, it } from "vitest";
import { z, type ZodType } from "zod";
import { batchCreateSchema } from "@/lib/contracts/batch";
import { labelField } from "@/lib/contracts/field-labels";
import { fitCreateSchema } from "@/lib/contracts/fit";
import {
  dispersionRequestSchema,
  gradientRequestSchema,
  labKineticsCreateSchema,
  sensitivityRequestSchema,
  turingMapRequestSchema,
} from "@/lib/contracts/kinetics";
import { imageReadoutSettingsSchema, tableReadoutSettingsSchema } from "@/lib/contracts/readout";
import { simulationRunRequestSchema } from "@/lib/contracts/simulation-run";
import { pixelSizeSchema } from "@/lib/contracts/study";
import { walkSchemaPaths } from "./walk-schema";

const FORMS: Record<string, ZodType> = {
  fit: fitCreateSchema,
  run: simulationRunRequestSchema,
  "lab kinetics": labKineticsCreateSchema,
  dispersion: dispersionRequestSchema,
  "Turing map": turingMapRequestSchema,
  sensitivity: sensitivityRequestSchema,
  gradient: gradientRequestSchema,
  "image readout": imageReadoutSettingsSchema,
  "table readout": tableReadoutSettingsSchema,
  batch: batchCreateSchema,
  // The upload form's fields (multipart): the file and the typed pixel size.
  upload: z.object({ file: z.string(), pixelSizeUm: pixelSizeSchema }),
};

// JSON names have a capital inside a word, a dot between names or brackets (common practice, no source).
const JSON_NAME = /[a-z][A-Z]|\w\.\w|\[\d*\]/;

describe("field labels", () => {
  for (const [form, schema] of Object.entries(FORMS)) {
    it(`every field of the ${form} form has a label without JSON names`, () => {
      const paths = walkSchemaPaths(schema);
      expect(paths.length).toBeGreaterThan(0);
      const missing = paths.filter((p) => labelField(p) === null).map((p) => p.join("."));
      expect(missing).toEqual([]);
      for (const p of paths) expect(labelField(p)).not.toMatch(JSON_NAME);
    });
  }

  it("the examples of the issue, positions from 1", () => {
    expect(labelField("pixelSizeUm")).toBe("Pixel size (µm per pixel)");
    expect(labelField("models[1].lengthScaleUm")).toBe("Length scale of the second kinetics (µm)");
    expect(labelField(["models", 1, "lengthScaleUm"])).toBe("Length scale of the second kinetics (µm)");
    expect(labelField("endTimeS")).toBe("Simulated time");
    expect(labelField("definition.reactions[0]", { species: ["A", "B"] })).toBe("Equation for dA/dt");
    expect(labelField("definition.reactions.1")).toBe("Equation 2 (the second species)");
    expect(labelField("data[2].wavelengthUm")).toBe("Wavelength of measurement 3 (µm)");
    expect(labelField("models.10.gridSize")).toBe("Grid size of the 11th kinetics");
  });

  it("a path no form has gets no label", () => {
    expect(labelField("noSuchField")).toBeNull();
    expect(labelField("")).toBeNull();
  });
});
