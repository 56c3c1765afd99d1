/**
 * Request bodies of the kinetics API: the lab's own kinetics (a definition checked by
 * `KineticsDefinitionSchema`, then compiled on the server) and the analyses (dispersion relation,
 * Turing-space map, sensitivities, gradients) of a catalogue or lab kinetics.
 *
 * JSON cannot carry NaN or ∞, and strings such as "NaN" or "1e3" are not numbers here: every
 * numeric field must be a finite JSON number.
 */
import { z } from "zod";
import { KineticsDefinitionSchema } from "@/lib/kinetics/definition-schema";

/** Largest interactive Turing map: cells (x.n × y.n) and wavenumbers per cell. */
export const MAX_INTERACTIVE_MAP_CELLS = 40_000;
export const MAX_INTERACTIVE_MAP_WAVENUMBERS = 200;
/** Wall-clock limit of one interactive map, ms (the server must answer within about a second). */
export const INTERACTIVE_MAP_TIME_LIMIT_MS = 1000;
/** Most positions along a gradient. */
export const MAX_GRADIENT_SAMPLES = 201;
/** Most rows of a pasted position,value table. */
export const MAX_GRADIENT_TABLE_ROWS = 2000;
/** Largest k grid of one dispersion relation. */
export const MAX_DISPERSION_GRID = 2000;

const finite = (what: string) => z.number(`${what} must be a finite number (text such as "NaN" is not a number)`);
const positive = (what: string) => finite(what).positive(`${what} must be above 0`);

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `at most ${max} characters`)
    .optional()
    .nullable()
    .transform((s) => (s ? s : null));

export const labKineticsCreateSchema = z.object({
  description: optionalText(5000),
  definition: KineticsDefinitionSchema,
});
/** Every edit saves a whole new definition as the next version. */
export const labKineticsUpdateSchema = labKineticsCreateSchema;
export type LabKineticsInput = z.input<typeof labKineticsCreateSchema>;

/** Which kinetics: a catalogue id (e.g. `schnakenberg`) or a lab kinetics id, at a version (default: latest). */
const kineticsRef = {
  kinetics: z
    .string("kinetics must be a catalogue id or a lab kinetics id")
    .min(1, "name the kinetics (a catalogue id or a lab kinetics id)")
    .max(64, "kinetics: at most 64 characters"),
  version: z
    .number("version must be a whole number")
    .int("version must be a whole number")
    .min(1, "version must be 1 or more")
    .optional(),
  parameters: z.record(z.string().max(32), finite("each parameter value")).optional(),
  lengthScaleUm: positive("lengthScaleUm (µm)").optional(),
  timeScaleS: positive("timeScaleS (s)").optional(),
};

const units = z.enum(["um", "model"], 'units must be "um" or "model"').optional();
export const domainSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("unbounded") }),
    z.object({ kind: z.literal("interval"), length: positive("domain.length"), units }),
    z.object({ kind: z.literal("rectangle"), lx: positive("domain.lx"), ly: positive("domain.ly"), units }),
    z.object({ kind: z.literal("sphere"), radius: positive("domain.radius"), units }),
  ],
  'domain.kind must be "unbounded", "interval", "rectangle" or "sphere"',
);
export type DomainInput = z.infer<typeof domainSchema>;

export const dispersionRequestSchema = z.object({
  ...kineticsRef,
  domain: domainSchema.optional(),
  gridSize: z
    .number()
    .int("gridSize must be a whole number")
    .min(16, "gridSize must be at least 16")
    .max(MAX_DISPERSION_GRID, `gridSize must be at most ${MAX_DISPERSION_GRID}`)
    .optional(),
});
export type DispersionRequest = z.infer<typeof dispersionRequestSchema>;

const axis = z.object({
  name: z.string("name the parameter of this axis").min(1).max(32),
  min: finite("axis min"),
  max: finite("axis max"),
  n: z
    .number("n must be a whole number of cells")
    .int("n must be a whole number of cells")
    .min(2, "n must be at least 2"),
  scale: z.enum(["linear", "log"], 'scale must be "linear" or "log"').optional(),
});

export const turingMapRequestSchema = z.object({
  ...kineticsRef,
  x: axis,
  y: axis,
  wavenumbers: z
    .number()
    .int("wavenumbers must be a whole number")
    .min(16, "wavenumbers must be at least 16")
    .optional(),
  target: z
    .object({
      wavelength: positive("target.wavelength"),
      tolerance: finite("target.tolerance").min(0, "target.tolerance must be 0 or more"),
    })
    .optional(),
});
export type TuringMapRequest = z.infer<typeof turingMapRequestSchema>;

export const sensitivityRequestSchema = z.object({
  ...kineticsRef,
  scale: z.object({ name: z.string().min(1).max(32), factor: positive("scale.factor") }).optional(),
});
export type SensitivityRequest = z.infer<typeof sensitivityRequestSchema>;

export const gradientProfileSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("linear"), from: finite("profile.from"), to: finite("profile.to") }),
    z.object({
      kind: z.literal("exponential"),
      source: finite("profile.source"),
      decayLength: positive("profile.decayLength"),
      floor: finite("profile.floor").optional(),
    }),
    /** A pasted table: one `position,value` pair per line (a header line is allowed). */
    z.object({ kind: z.literal("table"), text: z.string().max(200_000, "profile.text: at most 200000 characters") }),
  ],
  'profile.kind must be "linear", "exponential" or "table"',
);

export const gradientRequestSchema = z.object({
  ...kineticsRef,
  parameter: z.string("name the parameter that varies").min(1).max(32),
  profile: gradientProfileSchema,
  length: positive("length"),
  samples: z.number().int("samples must be a whole number").min(2, "samples must be at least 2").optional(),
});
export type GradientRequest = z.infer<typeof gradientRequestSchema>;
