/**
 * A batch: many files uploaded at once, with settings chosen once. Shared by the batch form,
 * the route handler and the API documentation.
 */
import { z } from "zod";
import { pixelSizeSchema } from "./study";

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `at most ${max} characters`)
    .optional()
    .nullable()
    .transform((s) => (s ? s : null));

/** An id as the server writes them (a UUID); anything else is refused before a lookup. */
const id = (what: string) =>
  z.string().regex(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i, `${what} must be an id`);

export const BATCH_TARGETS = ["specimen", "specimen-per-file", "one-specimen"] as const;

export const batchCreateSchema = z
  .object({
    name: optionalText(200),
    /** `specimen`: all files are images of `specimenId`; the others create specimens in `studyId`. */
    target: z.enum(BATCH_TARGETS, "target must be specimen, specimen-per-file or one-specimen"),
    specimenId: id("specimenId").optional(),
    studyId: id("studyId").optional(),
    /** The new specimen's label (`one-specimen` only). */
    specimenLabel: optionalText(120),
    /** Condition and stage of the specimens the batch creates. */
    condition: optionalText(120),
    stage: optionalText(60),
    /** µm/px for files that carry no pixel size; with `pixelSizeOverride`, for every file. */
    pixelSizeUm: z.union([pixelSizeSchema, z.null(), z.literal("")]).optional(),
    pixelSizeOverride: z.boolean().optional().default(false),
  })
  .superRefine((v, ctx) => {
    const need = (field: "specimenId" | "studyId" | "condition" | "specimenLabel", why: string) =>
      ctx.addIssue({ code: "custom", path: [field], message: why });
    if (v.target === "specimen" && !v.specimenId) need("specimenId", "choose the specimen the files belong to");
    if (v.target !== "specimen" && !v.studyId) need("studyId", "choose the study the new specimens go into");
    if (v.target !== "specimen" && !v.condition)
      need("condition", "name the condition of the new specimens (e.g. control)");
    if (v.target === "one-specimen" && !v.specimenLabel) need("specimenLabel", "give the new specimen a label");
    if (v.pixelSizeOverride && (v.pixelSizeUm === undefined || v.pixelSizeUm === null || v.pixelSizeUm === ""))
      ctx.addIssue({
        code: "custom",
        path: ["pixelSizeUm"],
        message: "give the pixel size in µm/px that should replace the files' own",
      });
  });
export type BatchInput = z.input<typeof batchCreateSchema>;
