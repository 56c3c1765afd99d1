/**
 * Plans a verification run for a lab: loads the fit it starts from, the kinetics and the earlier
 * run whose fields it continues, then lets the science core decide what the run will do and
 * whether it may (lib/simulation/plan-run.ts), mapping its refusals to 400/422 answers. The
 * result is the CLI's RUN.json plus the plan shown on the run page.
 */
import "server-only";
import { randomInt } from "node:crypto";
import { estimateSolverSeconds, planRun as planRunInCore, planRunSteadyState } from "@/lib/simulation";
import type { GradientShape } from "@/lib/stability";
import { DEFAULT_RUN_SNAPSHOTS, type SimulationRunRequest } from "@/lib/contracts/simulation-run";
import type { LabContext } from "../access";
import { withAppErrors } from "../core-errors";
import { services } from "../services";
import { resolveAnalysisKinetics } from "../kinetics/analyses";
import { getLabKineticsVersion } from "../kinetics/kinetics";
import { parseProfileTable } from "../kinetics/table";
import { readFitStart } from "./fit-start";
import { initialFieldFile, readRunStart } from "./start";
import type { RunPlan, RunSpec } from "./types";

export {
  LINEAR_THEORY_TOLERANCE,
  RUN_SNAPSHOT_VALUES_LIMIT,
  RUN_WORK_LIMIT,
  SOLVER_CELL_STEPS_PER_S,
} from "@/lib/simulation";

/** Seconds the solver needs for `work` cell-species-steps on this server's thread count. */
export const estimateSolverS = (work: number) => estimateSolverSeconds(work, services().config.simulationThreads);

/** The gradient's shape, a pasted table parsed (its errors name profile.text and the line). */
function readGradientShape(profile: NonNullable<SimulationRunRequest["gradient"]>["profile"]): GradientShape {
  return profile.kind === "table" ? { kind: "table", ...parseProfileTable(profile.text) } : profile;
}

export interface PlannedRun {
  spec: RunSpec;
  plan: RunPlan;
  kineticsKind: "catalogue" | "lab";
  kineticsRef: string;
  kineticsVersion: number | null;
  kineticsName: string;
  seed: string;
}

export async function planRun(ctx: LabContext, asked: SimulationRunRequest): Promise<PlannedRun> {
  const fit = asked.fit ? await readFitStart(ctx, asked.fit) : null;
  const req = fit
    ? {
        ...asked,
        kinetics: fit.kinetics,
        version: fit.version,
        lengthScaleUm: fit.lengthScaleUm,
        timeScaleS: fit.timeScaleS,
      }
    : asked;
  const { compiled, info } = await resolveAnalysisKinetics(ctx, req.kinetics, req.version);
  const definition =
    info.kind === "lab" ? (await getLabKineticsVersion(ctx, req.kinetics, info.version ?? undefined)).definition : null;
  const given = fit
    ? Object.fromEntries(
        compiled.parameters.map((q) => [q.name, fit.parameters[q.name]]).filter(([, v]) => v !== undefined),
      )
    : (req.parameters ?? {});
  const gradient = req.gradient;
  const state = withAppErrors(() =>
    planRunSteadyState({
      kinetics: compiled,
      units: info.units,
      parameters: given,
      grid: req.grid,
      endTimeS: req.endTimeS,
      dtS: req.dtS,
      scheme: req.scheme,
      timeStepping: req.timeStepping,
      tolerance: req.tolerance,
      snapshots: req.snapshots ?? DEFAULT_RUN_SNAPSHOTS,
      noiseAmplitude: req.noiseAmplitude,
      stopWhenStationary: req.stopWhenStationary,
      lengthScaleUm: req.lengthScaleUm,
      timeScaleS: req.timeScaleS,
      ...(gradient
        ? { gradient: { parameter: gradient.parameter, readShape: () => readGradientShape(gradient.profile) } }
        : {}),
    }),
  );
  const start = asked.startFrom ? await readRunStart(ctx, asked.startFrom.runId, compiled.species, state.grid) : null;
  const seed = req.seed ?? randomInt(0, 2 ** 32);
  const { spec, plan } = withAppErrors(() =>
    planRunInCore(state, {
      start: start
        ? {
            plan: start.plan,
            fromRun: start.fromRun,
            fieldFiles: compiled.species.map((_, s) => initialFieldFile(s)),
            warnings: start.warnings,
          }
        : null,
      fromFit: fit?.fromFit ?? null,
      kineticsSource: definition ? { definition } : { catalogue: info.id },
      seed,
      threads: services().config.simulationThreads,
    }),
  );
  // A run from given fields without added noise draws no random numbers: it has no seed to show.
  const shownSeed = start && !req.noiseAmplitude ? "none" : String(seed);
  return {
    spec,
    plan,
    kineticsKind: info.kind,
    kineticsRef: info.id,
    kineticsVersion: info.version,
    kineticsName: info.name,
    seed: shownSeed,
  };
}
