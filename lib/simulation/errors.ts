/** An invalid simulation option: `field` names the offending option (dot path). */
export class SimulationOptionError extends RangeError {
  constructor(
    /** Dot path of the option, e.g. `grid.cells`. */
    public readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = "SimulationOptionError";
  }
}

/** Throws a {@link SimulationOptionError} for `field` with the exact sentence `message`. */
export function failOption(field: string, message: string): never {
  throw new SimulationOptionError(field, message);
}
