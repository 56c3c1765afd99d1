/**
 * Settings of a spacing readout, shared by the readout form (browser), the route handlers and
 * the readouts table's `settings` JSON column. Images and tables take different settings; each
 * schema is strict, so a field meant for the other kind is refused by name.
 */
import { z } from "zod";

const px = (what: string) =>
  z.number(`${what} must be a number of pixels`).finite(`${what} must be a finite number of pixels`);

export const rectRoiSchema = z
  .object({
    kind: z.literal("rect"),
    x: px("roi.x"),
    y: px("roi.y"),
    width: px("roi.width"),
    height: px("roi.height"),
  })
  .strict();

export const polygonRoiSchema = z
  .object({
    kind: z.literal("polygon"),
    points: z
      .array(z.tuple([px("roi point x"), px("roi point y")]), "roi.points must be a list of [x, y] pixel pairs")
      .max(500, "roi.points: at most 500 vertices"),
  })
  .strict();

export const roiSchema = z.discriminatedUnion(
  "kind",
  [rectRoiSchema, polygonRoiSchema],
  'roi.kind must be "rect" or "polygon"',
);

/** Pixel size typed for this readout (µm/px); overrides the upload's. */
const pixelSizeOverride = z
  .number("pixelSizeUm must be a number in µm/px")
  .positive("pixelSizeUm must be above 0 µm/px")
  .max(10_000, "pixelSizeUm must be at most 10000 µm/px")
  .nullable()
  .optional();

export const imageReadoutSettingsSchema = z
  .object({
    /** Region of interest in source pixels; null = the whole image. */
    roi: roiSchema.nullable().default(null),
    /** Channel index from 0, or "luminance" (Rec. 709 weights). */
    channel: z
      .union([
        z.literal("luminance"),
        z
          .number()
          .int("channel must be a whole number")
          .min(0, "channel must be 0 or more")
          .max(15, "channel must be at most 15"),
      ])
      .default("luminance"),
    /** z-plane of a stack, from 0 (the form counts from 1). */
    plane: z
      .number("plane must be a number")
      .int("plane must be a whole number")
      .min(0, "plane must be 0 or more (planes count from 0 in the API)")
      .max(99_999, "plane must be at most 99999")
      .default(0),
    /** Time point of a stack, from 0 (the form counts from 1). */
    timePoint: z
      .number("timePoint must be a number")
      .int("timePoint must be a whole number")
      .min(0, "timePoint must be 0 or more (time points count from 0 in the API)")
      .max(99_999, "timePoint must be at most 99999")
      .default(0),
    /** "max-z": maximum-intensity projection over every plane (plane is then not used). */
    projection: z.enum(["none", "max-z"], 'projection must be "none" or "max-z"').default("none"),
    /** Negate intensities (dark spots on a light background). */
    invert: z.boolean("invert must be true or false").default(false),
    /** Background flattening: plane then a Gaussian background inside the tissue (auto), fitted plane, heavy blur, or off. */
    flatten: z
      .enum(["auto", "plane", "blur", "none"], 'flatten must be "auto", "plane", "blur" or "none"')
      .default("auto"),
    window: z.enum(["hann", "tukey", "none"], 'window must be "hann", "tukey" or "none"').default("hann"),
    /** Find the tissue region automatically (auto) or analyse the whole region (off). */
    tissueMask: z.enum(["auto", "off"], 'tissueMask must be "auto" or "off"').default("auto"),
    /** Axis of the local-wavelength profile. */
    profileAxis: z.enum(["x", "y"], 'profileAxis must be "x" or "y"').default("x"),
    pixelSizeUm: pixelSizeOverride,
  })
  .strict();

const column = (what: string) =>
  z
    .string(`${what} must be a column name`)
    .trim()
    .min(1, `${what} must name a column`)
    .max(200, `${what}: at most 200 characters`)
    .optional();

export const tableReadoutSettingsSchema = z
  .object({
    columns: z
      .object({
        x: column("columns.x"),
        y: column("columns.y"),
        position: column("columns.position"),
        spacing: column("columns.spacing"),
      })
      .strict()
      .optional(),
    /** Unit of the table's numbers; "px" needs a pixel size. */
    unit: z.enum(["um", "nm", "mm", "px"], 'unit must be "um", "nm", "mm" or "px"').optional(),
    /** Sheet of an XLSX workbook to read; the first sheet when not given. */
    sheet: z
      .string("sheet must be a sheet name")
      .trim()
      .min(1, "sheet must name a sheet")
      .max(200, "sheet: at most 200 characters")
      .optional(),
    pixelSizeUm: pixelSizeOverride,
  })
  .strict();

export type ImageReadoutSettingsInput = z.input<typeof imageReadoutSettingsSchema>;
export type ImageReadoutSettings = z.output<typeof imageReadoutSettingsSchema>;
export type TableReadoutSettingsInput = z.input<typeof tableReadoutSettingsSchema>;
export type TableReadoutSettings = z.output<typeof tableReadoutSettingsSchema>;
export type RoiInput = z.infer<typeof roiSchema>;

/** Query of the condition comparison: the two conditions Welch's test compares. */
export const comparisonQuerySchema = z.object({
  a: z.string().trim().max(120, "a: at most 120 characters").optional(),
  b: z.string().trim().max(120, "b: at most 120 characters").optional(),
  replicate: z
    .enum(["specimen", "image"], {
      message: "replicate: choose “specimen” (biological replicates, the default) or “image”",
    })
    .optional(),
});

/** Derived products a finished image readout stores next to the original. */
export const DERIVED_PRODUCTS = {
  "spectrum.json": "application/json",
  "preview.png": "image/png",
  "fft.png": "image/png",
} as const;
export type DerivedProduct = keyof typeof DERIVED_PRODUCTS;
