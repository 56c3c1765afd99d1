/**
 * Everything a verification run checks before its job is queued, so bad input answers at once
 * (400/422) and never costs a child process: the kinetics and parameters, a homogeneous steady
 * state where the expressions evaluate, the instability class (a stable state is refused: noise
 * decays and there is no pattern to read), the grid limits of the solver, the step rule and the
 * CPU budget of one run. The result is the CLI's RUN.json plus the plan shown on the run page.
 */
import "server-only";
import { randomInt } from "node:crypto";
import { resolveParameters, type KineticsDefinition } from "@/lib/kinetics";
import {
  chooseTimeStep,
  computeReactionStiffness,
  createGrid,
  createReactionSystemFromKinetics,
  readKineticsDiffusion,
  resolveParameterProfile,
  SIMULATION_LIMITS,
  type Grid,
  type ParameterProfile,
} from "@/lib/simulation";
import { computeDispersion, computeGradientDispersion, type DomainSpec } from "@/lib/stability";
import { DEFAULT_RUN_SNAPSHOTS, type SimulationRunRequest } from "@/lib/contracts/simulation-run";
import type { LabContext } from "../access";
import { withAppErrors } from "../core-errors";
import { AppError } from "../errors";
import { services } from "../services";
import { resolveAnalysisKinetics } from "../kinetics/analyses";
import { getLabKineticsVersion } from "../kinetics/kinetics";
import { withKineticsErrors } from "../kinetics/engine";
import { parseProfileTable } from "../kinetics/table";
import { readFitStart } from "./fit-start";
import { initialFieldFile, readRunStart } from "./start";
import type { RunPlan, RunSpec } from "./types";

/** Stiffness safety factor of the step rule h ≤ c/ρ (the solver's default, which the CLI uses). */
const STIFFNESS_SAFETY = 0.1;
/**
 * Measured solver speed in cell-species-steps per second by thread count: 256², 2 species, ETD2,
 * medians of 108 steps/s on one thread and 195 with a worker thread (lib/simulation/README.md, Speed).
 */
export const SOLVER_CELL_STEPS_PER_S: Readonly<Record<1 | 2, number>> = {
  1: 256 * 256 * 2 * 108,
  2: 256 * 256 * 2 * 195,
};
/**
 * Most cell-species-steps of one run: 256² cells × 2 species × 20 000 steps, about 100 s with two
 * threads (185 s with one) — a design choice so one run cannot hold the job queue for long.
 */
export const RUN_WORK_LIMIT = 256 * 256 * 2 * 20_000;
/** Seconds the solver needs for `work` cell-species-steps on this server's thread count. */
export const estimateSolverS = (work: number) => work / SOLVER_CELL_STEPS_PER_S[services().config.simulationThreads];
/** Most field values kept in snapshots (8 bytes each in memory: 128 MiB). */
export const RUN_SNAPSHOT_VALUES_LIMIT = 2 ** 24;
/** Fraction by which the simulated wavelength may differ from 2π/k* (the lib tests' tolerance, 20 %: common practice, no source). */
export const LINEAR_THEORY_TOLERANCE = 0.2;

const unprocessable = (field: string, message: string) => new AppError("unprocessable", message, { field });

const solverError = withAppErrors;

function toSolverProfile(
  req: NonNullable<SimulationRunRequest["gradient"]>,
  sampled: { x: number; value: number }[],
): ParameterProfile {
  const p = req.profile;
  if (p.kind === "linear") return { kind: "linear", axis: "x", fromValue: p.from, toValue: p.to };
  if (p.kind === "table") {
    const t = parseProfileTable(p.text);
    return { kind: "table", axis: "x", positionsUm: t.positions, values: t.values };
  }
  // The exponential form (with its floor) is taken exactly as the kinetics page evaluates it, at 101 points.
  return { kind: "table", axis: "x", positionsUm: sampled.map((s) => s.x), values: sampled.map((s) => s.value) };
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
  let definition: KineticsDefinition | null = null;
  if (info.kind === "lab")
    definition = (await getLabKineticsVersion(ctx, req.kinetics, info.version ?? undefined)).definition;
  const dimensional = info.units === "dimensional";
  const scales = dimensional ? {} : { lengthScaleUm: req.lengthScaleUm, timeScaleS: req.timeScaleS };
  const given = fit
    ? Object.fromEntries(
        compiled.parameters.map((q) => [q.name, fit.parameters[q.name]]).filter(([, v]) => v !== undefined),
      )
    : (req.parameters ?? {});
  const p = withKineticsErrors(() => resolveParameters(compiled, given, "parameters"));
  const params: Record<string, number> = Object.fromEntries(compiled.parameters.map((s, i) => [s.name, p[i]]));
  const grid: Grid = solverError(() => createGrid(req.grid));
  const units = dimensional ? ("um" as const) : ("model" as const);
  const domain: DomainSpec | undefined =
    grid.boundary !== "zero-flux"
      ? undefined
      : grid.dimensions === 1
        ? { kind: "interval", length: grid.lengthXUm, units }
        : { kind: "rectangle", lx: grid.lengthXUm, ly: grid.lengthYUm, units };
  const r = withKineticsErrors(() => computeDispersion(compiled, params, { ...scales, domain }));
  const steadyState = compiled.species.map((s) => r.steadyState.values[s]);
  const rates = new Float64Array(compiled.species.length);
  compiled.rates(Float64Array.from(steadyState), p, rates);
  if (!steadyState.every(Number.isFinite) || !rates.every(Number.isFinite)) {
    throw unprocessable(
      "parameters",
      `parameters: the reaction expressions do not give finite values at the steady state (${compiled.species.map((s, i) => `${s} = ${steadyState[i]}`).join(", ")}); check the expressions and parameter values.`,
    );
  }
  const start = asked.startFrom ? await readRunStart(ctx, asked.startFrom.runId, compiled.species, grid) : null;
  const warnings: string[] = [...(start?.warnings ?? [])];
  if (r.bands.length === 0) {
    if (!start)
      throw unprocessable(
        "parameters",
        `parameters: the homogeneous steady state is ${r.classification.label} at these parameter values — no mode grows, so the noise decays and there is no pattern to read. Choose parameters inside the Turing space (see the Turing-space map of this kinetics).`,
      );
    warnings.push(
      `The homogeneous steady state is ${r.classification.label} at these parameter values, so no new pattern would form from noise; the run shows whether the earlier pattern persists.`,
    );
  } else if (!r.fastest) {
    warnings.push(
      `The steady state is ${r.classification.label} at these parameter values and no mode with k > 0 grows fastest, so there is no linear prediction 2π/k* to compare with; the run is started anyway.`,
    );
  } else if (!r.classification.classes.includes("turing")) {
    warnings.push(
      `The steady state is ${r.classification.label}, not Turing-unstable, at these parameter values: the run is started, but 2π/k* of the fastest-growing mode is not a Turing prediction and the final pattern may oscillate or leave the steady state altogether.`,
    );
  }
  const diffusion = solverError(() => readKineticsDiffusion(compiled, p));

  let spatialParameters: Record<string, ParameterProfile> | undefined;
  let gradientPrediction: RunPlan["gradientPrediction"] = null;
  if (req.gradient) {
    const g = req.gradient;
    const gp =
      g.profile.kind === "table" ? { kind: "table" as const, ...parseProfileTable(g.profile.text) } : g.profile;
    const local = withKineticsErrors(() =>
      computeGradientDispersion(compiled, params, {
        ...scales,
        parameter: g.parameter,
        profile: gp,
        length: grid.lengthXUm,
        samples: 101,
      }),
    );
    spatialParameters = { [g.parameter]: toSolverProfile(g, local.points) };
    gradientPrediction = {
      parameter: g.parameter,
      positions: local.points.map((q) => q.x),
      values: local.points.map((q) => q.value),
      wavelengths: local.points.map((q) => q.wavelength),
    };
  }
  const cellParams: Record<string, number | Float64Array> = { ...params };
  for (const [name, profile] of Object.entries(spatialParameters ?? {}))
    cellParams[name] = solverError(() => resolveParameterProfile(profile, grid, `gradient.profile`));
  const system = createReactionSystemFromKinetics(compiled);
  // The solver takes ρ at the mean of given fields (lib/simulation/simulate.ts), so the plan does too.
  const rho = computeReactionStiffness(
    system,
    start ? start.plan.speciesMeans : steadyState,
    cellParams,
    grid.cellCount,
  );
  const rule = chooseTimeStep(req.endTimeS, rho, STIFFNESS_SAFETY, req.dtS ?? null);
  if (rule.steps > SIMULATION_LIMITS.maxSteps)
    throw unprocessable("dtS", `endTimeS / dtS needs ${rule.steps} steps; the limit is ${SIMULATION_LIMITS.maxSteps}.`);
  if (req.dtS !== undefined && req.dtS > rule.stiffnessLimitS) {
    warnings.push(
      `dtS = ${req.dtS} is above the stiffness limit ${STIFFNESS_SAFETY}/ρ = ${rule.stiffnessLimitS.toPrecision(4)} of the explicit reaction step (ρ = ${rho.toPrecision(4)} per time unit); the run uses ${rule.dtS.toPrecision(4)}.`,
    );
  }
  const n = compiled.species.length;
  const work = grid.cellCount * n * rule.steps;
  if (work > RUN_WORK_LIMIT) {
    throw unprocessable(
      "grid.cells",
      `grid.cells: ${grid.cellCount} cells × ${n} species × ${rule.steps} steps = ${work} cell-steps; one run may take at most ${RUN_WORK_LIMIT} (256² cells × 2 species × 20000 steps, about ${Math.round(estimateSolverS(RUN_WORK_LIMIT))} s on this server). Use fewer cells or a shorter endTimeS.`,
    );
  }
  const snapshotCount = req.snapshots ?? DEFAULT_RUN_SNAPSHOTS;
  if (grid.cellCount * n * snapshotCount > RUN_SNAPSHOT_VALUES_LIMIT) {
    throw unprocessable(
      "snapshots",
      `snapshots: ${snapshotCount} snapshots of ${grid.cellCount} cells × ${n} species keep ${grid.cellCount * n * snapshotCount} values; the limit is ${RUN_SNAPSHOT_VALUES_LIMIT}. Ask for fewer snapshots or fewer cells.`,
    );
  }
  const snapshotTimesS = Array.from({ length: snapshotCount }, (_, i) =>
    i === snapshotCount - 1 ? req.endTimeS : (req.endTimeS * i) / (snapshotCount - 1),
  );
  const seed = req.seed ?? randomInt(0, 2 ** 32);
  const lengthFactor = dimensional ? 1 : (req.lengthScaleUm ?? null);
  const spec: RunSpec = {
    kinetics: definition ? { definition } : { catalogue: info.id },
    parameters: params,
    ...(spatialParameters ? { spatialParameters } : {}),
    grid: { lengthUm: [...req.grid.lengthUm], cells: [...req.grid.cells], boundary: grid.boundary },
    endTimeS: req.endTimeS,
    ...(req.dtS !== undefined ? { dtS: req.dtS } : {}),
    scheme: req.scheme ?? "etd2",
    initial: start
      ? {
          fieldFiles: compiled.species.map((_, s) => initialFieldFile(s)),
          fromRun: start.fromRun,
          noiseAmplitude: req.noiseAmplitude ?? 0,
          seed,
        }
      : { steadyState, ...(req.noiseAmplitude !== undefined ? { noiseAmplitude: req.noiseAmplitude } : {}), seed },
    stopWhenStationary: req.stopWhenStationary ?? false,
    snapshotTimesS,
    ...(!dimensional && (req.lengthScaleUm || req.timeScaleS)
      ? { scales: { lengthScaleUm: req.lengthScaleUm, timeScaleS: req.timeScaleS } }
      : {}),
  };
  const plan: RunPlan = {
    species: [...compiled.species],
    units: info.units,
    lengthUnit: lengthFactor ? "µm" : "model length",
    timeUnit: dimensional || req.timeScaleS ? "s" : "model time",
    lengthFactor,
    timeFactor: dimensional ? 1 : (req.timeScaleS ?? null),
    steadyState,
    diffusion,
    dtS: rule.dtS,
    steps: rule.steps,
    spectralRadiusPerS: rho,
    stiffnessLimitS: rule.stiffnessLimitS,
    workCellSteps: work,
    estimatedCpuS: estimateSolverS(work),
    classification: r.classification.label,
    prediction: r.fastest
      ? {
          kStar: r.fastest.kStar,
          wavelength: r.fastest.wavelength,
          domainMode:
            r.domain && r.domain.fastestMode.k > 0
              ? {
                  k: r.domain.fastestMode.k,
                  wavelength: (2 * Math.PI) / r.domain.fastestMode.k,
                  indices: r.domain.fastestMode.indices,
                  growing: r.domain.patterningExpected,
                }
              : null,
        }
      : null,
    gradientPrediction,
    fromFit: fit?.fromFit ?? null,
    startFrom: start?.plan ?? null,
    warnings,
  };
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
