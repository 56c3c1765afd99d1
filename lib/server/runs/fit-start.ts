/**
 * A run started from a fit: the fitted kinetics (its version), every parameter at the fit for one
 * condition, the fit's length and time scales, and the measured wavelengths of that condition
 * (with the readouts they came from), so the run page can set the simulated pattern beside both
 * the prediction and the measurement.
 */
import "server-only";
import type { LabContext } from "../access";
import { AppError } from "../errors";
import type { FitProvenance } from "../fits/spec-types";
import type { StoredFitResult } from "../fits/result";
import { findFit } from "../fits/fits";
import type { RunPlan } from "./types";

export interface RunFitRef {
  fitId: string;
  /** Label of the fitted model (a comparison has several); the first when left out. */
  model?: string;
  condition: string;
}

export interface FitStart {
  kinetics: string;
  version: number | undefined;
  parameters: Record<string, number>;
  lengthScaleUm: number | undefined;
  timeScaleS: number | undefined;
  fromFit: NonNullable<RunPlan["fromFit"]>;
}

export async function readFitStart(ctx: LabContext, ref: RunFitRef): Promise<FitStart> {
  const row = await findFit(ctx, ref.fitId);
  if (row.status !== "succeeded" || !row.result)
    throw new AppError(
      "unprocessable",
      `fit.fitId: the fit “${row.name}” has not finished successfully (status ${row.status}); start the run from a finished fit.`,
      { field: "fit.fitId" },
    );
  const result = row.result as unknown as StoredFitResult;
  const model = ref.model === undefined ? result.models[0] : result.models.find((x) => x.label === ref.model);
  if (!model)
    throw new AppError(
      "bad_input",
      `fit.model: the fit has no model “${ref.model}” (it has ${result.models.map((x) => `“${x.label}”`).join(", ")}).`,
      { field: "fit.model" },
    );
  const prediction = model.predictions.find((p) => p.condition === ref.condition);
  if (!prediction)
    throw new AppError(
      "bad_input",
      `fit.condition: the fit has no condition “${ref.condition}” (it has ${model.predictions.map((p) => `“${p.condition}”`).join(", ")}).`,
      { field: "fit.condition" },
    );
  const provenance = row.provenance as unknown as FitProvenance;
  const data = provenance.data.filter((d) => d.condition === ref.condition);
  return {
    kinetics: model.kinetics.id,
    version: model.kinetics.version ?? undefined,
    parameters: prediction.parameters,
    lengthScaleUm: prediction.lengthScaleUm ?? undefined,
    timeScaleS: prediction.timeScaleS ?? undefined,
    fromFit: {
      fitId: row.id,
      fitName: row.name,
      model: model.label,
      condition: ref.condition,
      measuredMeanUm: prediction.measuredMeanUm,
      measuredSeUm: prediction.measuredSeUm,
      n: prediction.n,
      readouts: data
        .filter((d) => d.readoutId)
        .map((d) => ({ readoutId: d.readoutId!, filename: d.filename, measure: d.measure })),
    },
  };
}
