/**
 * JSON shape of a lab's own kinetics, shared by the compiler, the CLI and the API
 * (`KineticsDefinitionSchema.safeParse(body)` at the route; `compileKinetics` does the
 * semantic checks — symbols, species count, parsing — with exact messages).
 */
import { z } from "zod";
import { MAX_EXPRESSION_LENGTH } from "./expression-compiler";

/** Fewest and most species a lab kinetics may have. */
export const MIN_SPECIES = 2;
export const MAX_SPECIES = 6;
/** Most parameters a lab kinetics may declare. */
export const MAX_PARAMETERS = 40;

const expression = z.union([z.string().max(MAX_EXPRESSION_LENGTH), z.number()]);

export const ParameterDefinitionSchema = z.object({
  name: z.string().min(1).max(32),
  /** Default value; must lie in [min, max]. */
  default: z.number(),
  /** @default -Number.MAX_VALUE */
  min: z.number().optional(),
  /** @default Number.MAX_VALUE */
  max: z.number().optional(),
  meaning: z.string().max(200).optional(),
  unit: z.string().max(20).optional(),
});

export const KineticsDefinitionSchema = z.object({
  /** kebab-case id; @default "custom" */
  id: z
    .string()
    .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/)
    .max(64)
    .optional(),
  name: z.string().min(1).max(120),
  source: z.string().max(500).optional(),
  /** @default "non-dimensional" */
  units: z.enum(["dimensional", "non-dimensional"]).optional(),
  /** Species are concentrations (only non-negative steady states count); @default true */
  nonNegative: z.boolean().optional(),
  species: z
    .array(z.string().min(1).max(32))
    .min(MIN_SPECIES, `give at least ${MIN_SPECIES} species`)
    .max(MAX_SPECIES, `give at most ${MAX_SPECIES} species`),
  parameters: z.array(ParameterDefinitionSchema).max(MAX_PARAMETERS),
  /** Reaction term of each species, mathjs syntax, in the order of `species`. */
  reactions: z.array(expression).min(MIN_SPECIES).max(MAX_SPECIES),
  /**
   * Diffusion: a list of n diagonal entries, or a full n×n matrix (cross-diffusion);
   * numbers or expressions in the parameters (not the species).
   */
  diffusion: z.union([z.array(expression), z.array(z.array(expression))]),
});

export type KineticsDefinition = z.infer<typeof KineticsDefinitionSchema>;
export type ParameterDefinition = z.infer<typeof ParameterDefinitionSchema>;
