/**
 * Request body of a verification run. The server turns it into the `simulate` CLI's RUN.json
 * (lib/cli/commands/simulate.ts), which is what a run stores and what its job hands the CLI, so
 * the command line and the app mean the same thing by a run. Lengths and times are in the
 * kinetics' own units: µm and s for dimensional kinetics, model units for non-dimensional ones
 * (give lengthScaleUm and timeScaleS to see µm and s).
 */
import { z } from "zod";
import { gradientProfileSchema } from "./kinetics";

/** Most snapshots a run keeps (each is one image per species). */
export const MAX_RUN_SNAPSHOTS = 24;
/** Default number of snapshots over the run (evenly spaced, t = 0 and the end included). */
export const DEFAULT_RUN_SNAPSHOTS = 9;

const finite = (what: string) => z.number(`${what} must be a finite number`);
const positive = (what: string) => finite(what).positive(`${what} must be above 0`);

export const simulationRunRequestSchema = z.object({
  name: z.string().trim().max(200, "name: at most 200 characters").optional(),
  kinetics: z
    .string("kinetics must be a catalogue id or a lab kinetics id")
    .min(1, "name the kinetics (a catalogue id or a lab kinetics id)")
    .max(64, "kinetics: at most 64 characters"),
  version: z.number().int("version must be a whole number").min(1, "version must be 1 or more").optional(),
  parameters: z.record(z.string().max(32), finite("each parameter value")).optional(),
  grid: z.object({
    lengthUm: z
      .array(positive("grid.lengthUm[i]"))
      .min(1, "grid.lengthUm must list 1 (interval) or 2 (rectangle) lengths")
      .max(2, "grid.lengthUm must list 1 (interval) or 2 (rectangle) lengths"),
    cells: z.array(z.number().int("grid.cells must be whole numbers")).min(1).max(2),
    boundary: z.enum(["zero-flux", "periodic"], 'grid.boundary must be "zero-flux" or "periodic"').optional(),
  }),
  endTimeS: positive("endTimeS"),
  dtS: positive("dtS").optional(),
  scheme: z
    .enum(
      ["etd2", "implicit-euler", "integrating-factor"],
      'scheme must be "etd2", "implicit-euler" or "integrating-factor"',
    )
    .optional(),
  /** @default true: the run stops once the pattern is stationary (lib/simulation/README.md, Stationarity criterion). */
  stopWhenStationary: z.boolean().optional(),
  /** @default "adaptive" with scheme etd2 (error-controlled steps), "fixed" with the first-order schemes. */
  timeStepping: z.enum(["adaptive", "fixed"], 'timeStepping must be "adaptive" or "fixed"').optional(),
  /** Local error tolerance of adaptive steps (relative). @default 0.001 */
  tolerance: finite("tolerance")
    .positive("tolerance must be above 0")
    .max(0.1, "tolerance must be at most 0.1")
    .optional(),
  /** Whole number 0 … 2³²−1; a random one is drawn and recorded when left out. */
  seed: z
    .number()
    .int("seed must be a whole number")
    .min(0, "seed must be 0 or more")
    .max(4294967295, "seed must be at most 4294967295")
    .optional(),
  /**
   * A chosen initial field: the final fields of an earlier finished run of this lab (same cells and
   * species count), e.g. to see whether a pattern persists when a parameter changes.
   */
  startFrom: z.object({ runId: z.uuid("startFrom.runId must be a run id") }).optional(),
  /** Noise amplitude around the steady state (same for every species). @default 1 % of |c*|; 0 with startFrom */
  noiseAmplitude: finite("noiseAmplitude").min(0, "noiseAmplitude must be 0 or more").optional(),
  snapshots: z
    .number()
    .int("snapshots must be a whole number")
    .min(2, "snapshots must be at least 2")
    .max(MAX_RUN_SNAPSHOTS, `snapshots must be at most ${MAX_RUN_SNAPSHOTS}`)
    .optional(),
  /** One parameter varying along x, in the gradient forms of the kinetics page (positions in grid length units). */
  gradient: z.object({ parameter: z.string().min(1).max(32), profile: gradientProfileSchema }).optional(),
  /** Start from a finished fit: its kinetics, parameters and scales for one condition replace those above. */
  fit: z
    .object({
      fitId: z.uuid("fit.fitId must be a fit id"),
      model: z.string().max(200).optional(),
      condition: z
        .string("fit.condition must name a condition of the fit")
        .min(1, "fit.condition must name a condition of the fit")
        .max(200),
    })
    .optional(),
  lengthScaleUm: positive("lengthScaleUm (µm)").optional(),
  timeScaleS: positive("timeScaleS (s)").optional(),
  /** The earlier run of this lab whose settings were changed to make this one ("Change and run again"). */
  changedFrom: z.uuid("changedFrom must be a run id").optional(),
});
export type SimulationRunRequest = z.infer<typeof simulationRunRequestSchema>;
export type SimulationRunInput = z.input<typeof simulationRunRequestSchema>;
