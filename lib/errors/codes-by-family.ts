/**
 * Every code each core error family can throw, by family name: the type both error maps (HTTP in
 * lib/server/core-errors.ts, exit codes in lib/cli/core-errors.ts) are checked against, so a new
 * code without a meaning in either fails the type check. Its own file: the families import the
 * base class from ./core-error, and this file imports the families.
 */
import type { FitErrorCode } from "../fitting/errors";
import type { ImagingErrorCode } from "../imaging/errors";
import type { KineticsErrorCode } from "../kinetics/errors";
import type { ReadoutErrorCode } from "../readout/errors";
import type { SimulationErrorCode } from "../simulation/errors";
import type { SpacingErrorCode } from "../spacing/errors";
import type { SyntheticErrorCode } from "../synthetic/check-options";

export interface CodesByFamily {
  readout: ReadoutErrorCode;
  imaging: ImagingErrorCode;
  spacing: SpacingErrorCode;
  kinetics: KineticsErrorCode;
  fitting: FitErrorCode;
  simulation: SimulationErrorCode;
  synthetic: SyntheticErrorCode;
}
