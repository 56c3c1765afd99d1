import { z } from "zod";
import { parseTypedNumber } from "@/lib/format/typed-number";

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `at most ${max} characters`)
    .optional()
    .nullable()
    .transform((s) => (s ? s : null));

export const studyCreateSchema = z.object({
  name: z.string().trim().min(1, "give the study a name").max(200, "at most 200 characters"),
  tissue: z.string().trim().min(1, "name the tissue (e.g. dorsal skin)").max(120, "at most 120 characters"),
  organism: z.string().trim().min(1, "name the organism").max(120, "at most 120 characters"),
  description: optionalText(5000),
});
export const studyUpdateSchema = studyCreateSchema.partial();
export type StudyInput = z.input<typeof studyCreateSchema>;

export const specimenCreateSchema = z.object({
  label: z.string().trim().min(1, "give the specimen a label").max(120, "at most 120 characters"),
  condition: z.string().trim().min(1, "name the condition (e.g. control)").max(120, "at most 120 characters"),
  stage: optionalText(60),
  genotype: optionalText(120),
  notes: optionalText(5000),
});
export const specimenUpdateSchema = specimenCreateSchema.partial();
export type SpecimenInput = z.input<typeof specimenCreateSchema>;

/**
 * Pixel size typed by the uploader, µm/px; used when the file carries none. A form field's text
 * is read as a person types it ("0,65" is 0.65; see `parseTypedNumber`).
 */
export const pixelSizeSchema = z.preprocess(
  (value, ctx) => {
    if (typeof value !== "string") return value;
    const typed = parseTypedNumber(value);
    if (typed.ok) return typed.value;
    ctx.addIssue({ code: "custom", message: typed.message, input: value });
    return z.NEVER;
  },
  z
    .number("pixel size must be a number in µm/px")
    .positive("pixel size must be above 0 µm/px")
    .max(10_000, "pixel size must be at most 10000 µm/px"),
);

/** Renames a condition on every specimen of a study: PATCH /api/v1/labs/:labId/studies/:studyId/conditions. */
export const conditionRenameSchema = z
  .object({
    from: z.string("from must be the condition to rename").trim().min(1, "from: name the condition to rename"),
    to: z
      .string("to must be the new name")
      .trim()
      .min(1, "to: name the new condition (e.g. control)")
      .max(120, "to: at most 120 characters"),
  })
  .strict();
