/** Builds the body of POST /api/v1/labs/:labId/runs from the run form's state; the server checks it. */
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import type { RunDraft, RunPrefill } from "./use-run-draft";
import { optionalTypedNumber, typedNumberOrText } from "@/lib/format/typed-number";

/** The fields of the form the body is built from (the draft's state, without its setters). */
type RunFields = Pick<
  RunDraft,
  | "values"
  | "dims"
  | "lx"
  | "ly"
  | "cells"
  | "boundary"
  | "endTime"
  | "dt"
  | "stationary"
  | "seed"
  | "noise"
  | "snapshots"
  | "startFrom"
  | "gradParam"
  | "gradFrom"
  | "gradTo"
  | "dimensional"
  | "lengthScale"
  | "timeScale"
>;

// Typed numbers ("0,65" too); text that is no number goes to the server, which names the field.
const num = optionalTypedNumber;
const req = typedNumberOrText;

export function buildRunBody(d: RunFields, info: KineticsInfoDto, prefill: RunPrefill) {
  return {
    kinetics: info.id,
    ...(info.version ? { version: info.version } : {}),
    parameters: Object.fromEntries(Object.entries(d.values).map(([k, v]) => [k, req(v)])),
    grid: {
      lengthUm: d.dims === "2" ? [req(d.lx), req(d.ly)] : [req(d.lx)],
      cells: d.dims === "2" ? [req(d.cells), req(d.cells)] : [req(d.cells)],
      boundary: d.boundary,
    },
    endTimeS: req(d.endTime),
    dtS: num(d.dt),
    stopWhenStationary: d.stationary,
    seed: num(d.seed),
    noiseAmplitude: num(d.noise),
    snapshots: num(d.snapshots),
    ...(d.startFrom ? { startFrom: { runId: d.startFrom } } : {}),
    ...(d.gradParam
      ? {
          gradient: {
            parameter: d.gradParam,
            profile: { kind: "linear", from: req(d.gradFrom), to: req(d.gradTo) },
          },
        }
      : {}),
    ...(!d.dimensional ? { lengthScaleUm: num(d.lengthScale), timeScaleS: num(d.timeScale) } : {}),
    ...(prefill.fit
      ? { fit: { fitId: prefill.fit.fitId, condition: prefill.fit.condition, model: prefill.fit.model } }
      : {}),
    ...(prefill.change ? { scheme: prefill.change.scheme, changedFrom: prefill.change.changedFrom.id } : {}),
  };
}
