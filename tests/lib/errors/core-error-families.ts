/**
 * Every code the science core can throw, one sample error per family and code, built with the
 * family's own class. The lists come from the families' exported code lists, so a new code shows
 * up here (and in the mapper tests) without editing this file.
 */
import type { CoreError, CoreErrorFamily } from "@/lib/errors";
import { FIT_ERROR_CODES, FitError } from "@/lib/fitting";
import { IMAGING_ERROR_CODES, ImagingError } from "@/lib/imaging";
import { KINETICS_ERROR_CODES, KineticsAnalysisError, KineticsInputError, KineticsLimitError } from "@/lib/kinetics";
import { READOUT_ERROR_CODES, ReadoutError } from "@/lib/readout";
import { SIMULATION_ERROR_CODES, SimulationOptionError } from "@/lib/simulation";
import { SPACING_ERROR_CODES, SpacingError } from "@/lib/spacing";
import { SYNTHETIC_ERROR_CODES, SyntheticOptionError } from "@/lib/synthetic";

export const MESSAGE = "sample sentence naming the limit (5 µm)";

/** One sample of each code of each family: [family, code, error]. */
export function sampleCoreErrors(): [CoreErrorFamily, string, CoreError][] {
  const kinetics = (code: (typeof KINETICS_ERROR_CODES)[number]) =>
    code === "cannot_analyse"
      ? new KineticsAnalysisError("parameters.a", MESSAGE)
      : code === "too_large"
        ? new KineticsLimitError("x.n", MESSAGE)
        : new KineticsInputError("parameters.a", MESSAGE, code);
  const rows: CoreError[] = [
    ...READOUT_ERROR_CODES.map((c) => new ReadoutError(c, MESSAGE, "roi")),
    ...IMAGING_ERROR_CODES.map((c) => new ImagingError(c, MESSAGE, "bitDepth")),
    ...SPACING_ERROR_CODES.map(() => new SpacingError(MESSAGE, "spacing", 3, "spacing")),
    ...KINETICS_ERROR_CODES.map(kinetics),
    ...FIT_ERROR_CODES.map((c) => new FitError(c, MESSAGE, "parameters.d.start")),
    ...SIMULATION_ERROR_CODES.map(() => new SimulationOptionError("grid.cells", MESSAGE)),
    ...SYNTHETIC_ERROR_CODES.map(() => new SyntheticOptionError("width", MESSAGE)),
  ];
  return rows.map((e) => [e.family, e.code, e]);
}

/** The code lists by family, to check the mappers' tables cover exactly these. */
export const CODE_LISTS: Record<CoreErrorFamily, readonly string[]> = {
  readout: READOUT_ERROR_CODES,
  imaging: IMAGING_ERROR_CODES,
  spacing: SPACING_ERROR_CODES,
  kinetics: KINETICS_ERROR_CODES,
  fitting: FIT_ERROR_CODES,
  simulation: SIMULATION_ERROR_CODES,
  synthetic: SYNTHETIC_ERROR_CODES,
};
