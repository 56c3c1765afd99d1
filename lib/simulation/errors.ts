import { CoreError } from "../errors/core-error";

/** The one reason the solver refuses a run: an option out of range (the app answers 422). */
export const SIMULATION_ERROR_CODES = ["bad_option"] as const;
export type SimulationErrorCode = (typeof SIMULATION_ERROR_CODES)[number];

/** An invalid simulation option: `field` names the offending option (dot path). */
export class SimulationOptionError extends CoreError<SimulationErrorCode> {
  readonly family = "simulation";
  /** Dot path of the option, e.g. `grid.cells`. */
  declare readonly field: string;
  constructor(field: string, message: string) {
    super("bad_option", message, field);
    this.name = "SimulationOptionError";
  }
}

/** Throws a {@link SimulationOptionError} for `field` with the exact sentence `message`. */
export function failOption(field: string, message: string): never {
  throw new SimulationOptionError(field, message);
}
