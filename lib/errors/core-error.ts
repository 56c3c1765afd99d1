/**
 * The one base of every error the science core throws on purpose. Each family (readout, imaging,
 * spacing, kinetics, fitting, simulation, synthetic) keeps its own class and constructor; what they
 * share is a stable `code` (one of the family's exported code list), the `family`, and the input
 * `field` at fault when there is one. The app maps `family` + `code` to an HTTP status
 * (`lib/server/core-errors.ts`) and to an exit code (`lib/cli/core-errors.ts`); both tables are
 * exhaustive over the code lists, so a new code that is not mapped fails the type check and the
 * tests instead of reaching a user as a 500.
 *
 * It extends RangeError because every such error says an input lies outside what a method accepts,
 * and the simulation and kinetics option errors were RangeErrors before (callers test for that).
 */
export type CoreErrorFamily = "readout" | "imaging" | "spacing" | "kinetics" | "fitting" | "simulation" | "synthetic";

export abstract class CoreError<C extends string = string> extends RangeError {
  abstract readonly family: CoreErrorFamily;
  constructor(
    /** Stable machine-readable reason, one of the family's code list. */
    public readonly code: C,
    message: string,
    /** The option or input at fault (dot path, e.g. `grid.cells`), when there is one. */
    public readonly field?: string,
  ) {
    super(message);
  }
}

/** True for any error of the core's families. */
export function isCoreError(err: unknown): err is CoreError {
  return err instanceof CoreError;
}
