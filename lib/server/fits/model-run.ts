/**
 * One model of a stored fit, fitted in this process: the same steps as `cli fit` (catalogue
 * kinetics by id, a lab kinetics compiled from the definition stored with the fit). Imports only
 * the numerical core, so the child-process entry (`fit-child.ts`) can run it without the server.
 */
import "server-only";
import { fitWavelengths, type WavelengthFitResult } from "@/lib/fitting";
import { createKineticsPredictor } from "@/lib/fitting/kinetics-predictor";
import { getCatalogueKinetics, resolveKinetics, type CompiledKinetics } from "@/lib/kinetics";
import type { StoredFitModel, StoredFitSpec } from "./spec-types";

/** The compiled kinetics of a stored model. */
export function compileStoredModel(model: StoredFitModel): CompiledKinetics {
  return model.definition
    ? resolveKinetics({ definition: model.definition })
    : getCatalogueKinetics(model.kinetics, "kinetics");
}

/** The single-model FIT.json of one model of a stored spec (what `cli fit --spec` reads). */
export function singleModelFile(spec: StoredFitSpec, model: StoredFitModel) {
  return {
    kinetics: model.kinetics,
    ...(model.lengthScaleUm !== undefined ? { lengthScaleUm: model.lengthScaleUm } : {}),
    ...(model.timeScaleS !== undefined ? { timeScaleS: model.timeScaleS } : {}),
    ...(model.gridSize !== undefined ? { gridSize: model.gridSize } : {}),
    parameters: model.parameters,
    data: spec.data,
    options: spec.options,
    ...(model.definition ? { definition: model.definition } : {}),
  };
}

/** Fits one model to the spec's data (synchronous; ~1–5 s with profiles). */
export function fitStoredModel(spec: StoredFitSpec, model: StoredFitModel): WavelengthFitResult {
  const predictor = createKineticsPredictor(compileStoredModel(model), {
    lengthScaleUm: model.lengthScaleUm,
    timeScaleS: model.timeScaleS,
    gridSize: model.gridSize,
  });
  return fitWavelengths({ data: spec.data, parameters: model.parameters, options: spec.options }, predictor);
}
