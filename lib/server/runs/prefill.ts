/**
 * "Change and run again": the run form filled in from a stored run — its kinetics (at the version
 * run), parameters and scales (or the fit it started from), grid, time, step cap, initial state
 * (seed, noise, the earlier run it continued), snapshots and a linear gradient — read back from
 * its RUN.json and plan. The original run is never changed; the new one records where it came from.
 */
import "server-only";
import type { LabContext } from "../access";
import { findRun } from "./runs";
import type { RunPlan, RunSpec } from "./types";

/** Every field as the text the form shows. */
export interface RunChangePrefill {
  changedFrom: { id: string; name: string };
  kinetics: string;
  version: string | undefined;
  parameters: Record<string, string>;
  lengthScaleUm: string | undefined;
  timeScaleS: string | undefined;
  /** The fit the run started from: kinetics, parameters and scales stay the fit's. */
  fit: { fitId: string; condition: string; model: string } | undefined;
  startFrom: string | undefined;
  grid: { dims: "1" | "2"; lx: string; ly: string; cells: string; boundary: "zero-flux" | "periodic" };
  endTime: string;
  dt: string;
  /** The form has no field for the scheme: sent again as it was. */
  scheme: RunSpec["scheme"];
  stationary: boolean;
  seed: string;
  noise: string;
  snapshots: string;
  gradient: { parameter: string; from: string; to: string } | undefined;
  /** What the form cannot show as it was, in words. */
  notes: string[];
}

const text = (x: number) => String(x);

/** The form's fields from the run `runId` of this lab (404 for another lab's or a missing one). */
export async function readRunPrefill(ctx: LabContext, runId: string): Promise<RunChangePrefill> {
  const row = await findRun(ctx, runId);
  const spec = row.spec as unknown as RunSpec;
  const plan = row.plan as unknown as RunPlan;
  const notes: string[] = [];
  const { cells, lengthUm, boundary } = spec.grid;
  if (cells.length === 2 && cells[0] !== cells[1])
    notes.push(
      `The run had ${cells.join(" × ")} cells; the form sets the same number on both axes, filled with ${cells[0]}.`,
    );
  let gradient: RunChangePrefill["gradient"];
  for (const [parameter, field] of Object.entries(spec.spatialParameters ?? {})) {
    if (field.kind === "linear" && !gradient)
      gradient = { parameter, from: text(field.fromValue), to: text(field.toValue) };
    else
      notes.push(
        `${parameter} varied in space (${field.kind}); the form has only a linear gradient, so it is left out.`,
      );
  }
  const fromRun = "fromRun" in spec.initial ? spec.initial.fromRun : undefined;
  const from = plan.fromFit;
  return {
    changedFrom: { id: row.id, name: row.name },
    kinetics: row.kineticsRef,
    version: row.kineticsVersion === null ? undefined : text(row.kineticsVersion),
    parameters: Object.fromEntries(Object.entries(spec.parameters).map(([k, v]) => [k, text(v)])),
    lengthScaleUm: spec.scales?.lengthScaleUm === undefined ? undefined : text(spec.scales.lengthScaleUm),
    timeScaleS: spec.scales?.timeScaleS === undefined ? undefined : text(spec.scales.timeScaleS),
    fit: from ? { fitId: from.fitId, condition: from.condition, model: from.model } : undefined,
    startFrom: fromRun?.runId,
    grid: {
      dims: cells.length === 2 ? "2" : "1",
      lx: text(lengthUm[0]),
      ly: text(lengthUm[1] ?? lengthUm[0]),
      cells: text(cells[0]),
      boundary,
    },
    endTime: text(spec.endTimeS),
    dt: spec.dtS === undefined ? "" : text(spec.dtS),
    scheme: spec.scheme,
    stationary: spec.stopWhenStationary,
    seed: text(spec.initial.seed),
    noise: spec.initial.noiseAmplitude === undefined ? "" : text(spec.initial.noiseAmplitude),
    snapshots: text(spec.snapshotTimesS.length),
    gradient,
    notes,
  };
}
