/**
 * Request bodies of the fits API, shared by the fit builder (browser) and the route handlers.
 * A fit names its data (readouts of the lab, or explicit wavelengths), one or more kinetics with
 * their parameter settings, and options; the server turns it into the command line's FIT.json.
 *
 * Every numeric field must be a finite JSON number. Deeper checks (bounds that exclude a start,
 * all parameters fixed, mixed kinds in a condition, no Turing region) are the fitting core's and
 * answer 422 naming the field.
 */
import { z } from "zod";

/** Most data points of one fit, most kinetics of one comparison. */
export const MAX_FIT_DATA = 200;
export const MAX_FIT_MODELS = 6;

const finite = (what: string) => z.number(`${what} must be a finite number`);
const positive = (what: string) => finite(what).positive(`${what} must be above 0`);

export const MEASUREMENT_KINDS = ["fourier", "nearest-neighbour"] as const;
const kind = z.enum(
  MEASUREMENT_KINDS,
  'kind must be "fourier" (a Fourier wavelength) or "nearest-neighbour" (spacing of hexagonal spots)',
);

/** The tissue's size in µm, so only its admissible modes count (zero-flux boundaries). */
export const fitDomainSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("interval"), length: positive("domain.length (µm)") }).strict(),
    z.object({ kind: z.literal("rectangle"), lx: positive("domain.lx (µm)"), ly: positive("domain.ly (µm)") }).strict(),
  ],
  'domain.kind must be "interval" or "rectangle" (sizes in µm)',
);
export type FitDomainInput = z.infer<typeof fitDomainSchema>;

/**
 * One datum: a readout of this lab (its wavelength and uncertainty are read from it; `kind`
 * picks the Fourier wavelength or, for spots, the nearest-neighbour spacing) or explicit numbers.
 */
export const fitDatumSchema = z
  .object({
    readoutId: z.uuid("readoutId must be a readout id").optional(),
    /** Condition label; for a readout, its specimen's condition unless given. */
    condition: z
      .string("condition must be text")
      .trim()
      .min(1, "condition must not be empty")
      .max(120, "condition: at most 120 characters")
      .optional(),
    kind: kind.optional(),
    wavelengthUm: positive("wavelengthUm (µm)").optional(),
    uncertaintyUm: positive("uncertaintyUm (µm)").optional(),
    domain: fitDomainSchema.optional(),
  })
  .strict();
export type FitDatumInput = z.infer<typeof fitDatumSchema>;

const bounds = {
  lower: finite("lower"),
  upper: finite("upper"),
  log: z.boolean("log must be true or false").optional(),
};
const perCondition = z.union([finite("value"), z.record(z.string().max(120), finite("each per-condition value"))]);

export const parameterSettingSchema = z.discriminatedUnion(
  "mode",
  [
    z.object({ mode: z.literal("fixed"), value: perCondition }).strict(),
    z.object({ mode: z.literal("free"), start: finite("start"), ...bounds }).strict(),
    z.object({ mode: z.literal("per-condition"), start: perCondition, ...bounds }).strict(),
  ],
  'mode must be "fixed", "free" or "per-condition"',
);

export const fitModelSchema = z
  .object({
    /** A catalogue id (e.g. `schnakenberg`) or a lab kinetics id. */
    kinetics: z
      .string("kinetics must be a catalogue id or a lab kinetics id")
      .min(1, "name the kinetics")
      .max(64, "kinetics: at most 64 characters"),
    /** Lab kinetics: the version fitted (default: the latest, recorded). */
    version: z.number().int("version must be a whole number").min(1, "version must be 1 or more").optional(),
    label: z.string().trim().min(1).max(80, "label: at most 80 characters").optional(),
    lengthScaleUm: positive("lengthScaleUm (µm)").optional(),
    timeScaleS: positive("timeScaleS (s)").optional(),
    gridSize: z
      .number()
      .int("gridSize must be a whole number")
      .min(32, "gridSize must be at least 32")
      .max(1000, "gridSize must be at most 1000")
      .optional(),
    /** Settings by parameter name; parameters left out stay fixed at their defaults. */
    parameters: z.record(z.string().min(1).max(32), parameterSettingSchema, "parameters must map names to settings"),
  })
  .strict();
export type FitModelInput = z.infer<typeof fitModelSchema>;

export const fitOptionsSchema = z
  .object({
    seededStarts: z.number().int().min(0).max(20, "options.seededStarts must be at most 20").optional(),
    turingSamples: z.number().int().min(0).max(400, "options.turingSamples must be at most 400").optional(),
    seed: z.string().min(1).max(64).optional(),
    absoluteUncertainties: z.boolean().optional(),
    profiles: z.boolean().optional(),
    reachSigma: positive("options.reachSigma").optional(),
    valleyPoints: z.number().int().min(0).max(101, "options.valleyPoints must be at most 101").optional(),
  })
  .strict();

export const fitCreateSchema = z
  .object({
    name: z.string("name the fit").trim().min(1, "name the fit").max(200, "name: at most 200 characters"),
    data: z
      .array(fitDatumSchema, "data must be a list of measurements")
      .max(MAX_FIT_DATA, `data: at most ${MAX_FIT_DATA} measurements`),
    models: z
      .array(fitModelSchema, "models must be a list of kinetics")
      .min(1, "models: choose at least one kinetics")
      .max(MAX_FIT_MODELS, `models: at most ${MAX_FIT_MODELS} kinetics in one comparison`),
    options: fitOptionsSchema.optional(),
    /**
     * `with-specimen-spread` (default): the sample SD of each condition's replicate specimens is added
     * in quadrature, so biological variation between specimens counts too. `per-readout`: each datum
     * weighs by its own uncertainty only.
     */
    uncertainty: z
      .enum(["per-readout", "with-specimen-spread"], 'uncertainty must be "per-readout" or "with-specimen-spread"')
      .optional(),
    /**
     * `specimens` (default): images of one specimen are averaged first and a repeated file counts once;
     * `images`: every readout is its own datum (pseudo-replication when a specimen has several images).
     */
    replicates: z.enum(["specimens", "images"], 'replicates must be "specimens" or "images"').optional(),
    /** The earlier fit of this lab whose settings were changed to make this one ("Change and re-run"). */
    changedFrom: z.uuid("changedFrom must be a fit id").optional(),
  })
  .strict();
export type FitCreateInput = z.input<typeof fitCreateSchema>;
export type FitCreate = z.infer<typeof fitCreateSchema>;

export const FIT_SORTS = ["createdAt", "name", "status"] as const;
