/**
 * What a verification run will do and whether it may, decided before its job is queued so bad
 * input answers at once and never costs a child process: the kinetics' parameters, a homogeneous
 * steady state where the expressions evaluate, the instability class (a stable state is refused:
 * noise decays and there is no pattern to read), the grid limits of the solver, the step rule, the
 * work and snapshot limits. Two steps, because the caller reads an earlier run's fields (to start
 * from) between them, on the grid the first step checked. Pure: no I/O, no clock, no randomness
 * (the caller picks the seed). Refusals throw SimulationOptionError with the field; kinetics
 * errors pass through as the kinetics core throws them.
 */
import { KineticsLimitError } from "../kinetics/errors";
import { resolveParameters } from "../kinetics/parameters";
import { computeDispersion, computeGradientDispersion, type DomainSpec } from "../stability";
import { failOption } from "./errors";
import { readKineticsDiffusion, createReactionSystemFromKinetics } from "./from-kinetics";
import { createGrid } from "./grid";
import { SIMULATION_LIMITS } from "./limits";
import {
  estimateSolverSeconds,
  RUN_SNAPSHOT_VALUES_LIMIT,
  RUN_STIFFNESS_SAFETY,
  RUN_WORK_LIMIT,
  type RunPlan,
  type RunPlanContext,
  type RunRequest,
  type RunSpec,
  type RunSteadyState,
} from "./run-plan";
import { evaluateSpatialParameterField, type SpatialParameterField } from "./spatial-parameters";
import { chooseTimeStep, computeReactionStiffness } from "./step-size";
import { planRunTail, toSolverField } from "./plan-run-spec";

/** Step 1: parameters, grid, steady state and its dispersion; refuses non-finite reaction terms. */
export function planRunSteadyState(request: RunRequest): RunSteadyState {
  const compiled = request.kinetics;
  const dimensional = request.units === "dimensional";
  const scales = dimensional ? {} : { lengthScaleUm: request.lengthScaleUm, timeScaleS: request.timeScaleS };
  const values = resolveParameters(compiled, request.parameters, "parameters");
  const params: Record<string, number> = Object.fromEntries(compiled.parameters.map((s, i) => [s.name, values[i]]));
  const grid = createGrid(request.grid);
  const units = dimensional ? ("um" as const) : ("model" as const);
  const domain: DomainSpec | undefined =
    grid.boundary !== "zero-flux"
      ? undefined
      : grid.dimensions === 1
        ? { kind: "interval", length: grid.lengthXUm, units }
        : { kind: "rectangle", lx: grid.lengthXUm, ly: grid.lengthYUm, units };
  const dispersion = dispersionInBox(compiled, params, scales, domain);
  const steadyState = compiled.species.map((s) => dispersion.steadyState.values[s]);
  const rates = new Float64Array(compiled.species.length);
  compiled.rates(Float64Array.from(steadyState), values, rates);
  if (!steadyState.every(Number.isFinite) || !rates.every(Number.isFinite)) {
    failOption(
      "parameters",
      `parameters: the reaction expressions do not give finite values at the steady state (${compiled.species.map((s, i) => `${s} = ${steadyState[i]}`).join(", ")}); check the expressions and parameter values.`,
    );
  }
  return { request, dimensional, scales, values, params, grid, dispersion, steadyState };
}

/**
 * The dispersion relation with the box's admissible modes; a box so large against the pattern that
 * it holds more modes than are counted is, for linear theory, unbounded: its fastest mode is then
 * left out and 2π/k* stands alone (the run is not refused for it).
 */
function dispersionInBox(
  compiled: RunRequest["kinetics"],
  params: Record<string, number>,
  scales: { lengthScaleUm?: number; timeScaleS?: number },
  domain: DomainSpec | undefined,
) {
  try {
    return computeDispersion(compiled, params, { ...scales, domain });
  } catch (err) {
    if (!(err instanceof KineticsLimitError && err.field === "domain")) throw err;
    return computeDispersion(compiled, params, scales);
  }
}

/** Fewer cells per fastest wavelength than a spectral method resolves a pattern with (common practice, no source). */
const MIN_CELLS_PER_WAVELENGTH = 4;

/** A warning when the grid has fewer than 4 cells per 2π/k* along an axis, else null. */
function coarseGridWarning(grid: RunSteadyState["grid"], wavelength: number | undefined): string | null {
  if (wavelength === undefined || !Number.isFinite(wavelength) || wavelength <= 0) return null;
  const cellSize = Math.max(grid.lengthXUm / grid.nx, grid.dimensions === 2 ? grid.lengthYUm / grid.ny : 0);
  const perWavelength = wavelength / cellSize;
  if (perWavelength >= MIN_CELLS_PER_WAVELENGTH) return null;
  return `The grid has ${perWavelength.toPrecision(2)} cells per predicted wavelength 2π/k* = ${wavelength.toPrecision(4)} (the box is about ${Math.round(grid.lengthXUm / wavelength)} wavelengths across); at least ${MIN_CELLS_PER_WAVELENGTH} are needed to resolve the pattern, so its wavelength will not be read reliably. Use a smaller box or more cells per axis.`;
}

/** Step 2: the instability class, diffusion, gradient, step rule and limits; the spec and the plan. */
export function planRun(state: RunSteadyState, context: RunPlanContext): { spec: RunSpec; plan: RunPlan } {
  const { request: req, grid, dispersion: r, steadyState, values, params, scales } = state;
  const compiled = req.kinetics;
  const { start } = context;
  const warnings: string[] = [...(start?.warnings ?? [])];
  if (r.bands.length === 0) {
    if (!start)
      failOption(
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
  const coarse = coarseGridWarning(grid, r.fastest?.wavelength);
  if (coarse) warnings.push(coarse);
  const diffusion = readKineticsDiffusion(compiled, values);

  let spatialParameters: Record<string, SpatialParameterField> | undefined;
  let gradientPrediction: RunPlan["gradientPrediction"] = null;
  if (req.gradient) {
    const g = req.gradient;
    const shape = g.readShape();
    const local = computeGradientDispersion(compiled, params, {
      ...scales,
      parameter: g.parameter,
      profile: shape,
      length: grid.lengthXUm,
      samples: 101,
    });
    spatialParameters = { [g.parameter]: toSolverField(shape, local.points) };
    gradientPrediction = {
      parameter: g.parameter,
      positions: local.points.map((q) => q.x),
      values: local.points.map((q) => q.value),
      wavelengths: local.points.map((q) => q.wavelength),
    };
  }
  const cellParams: Record<string, number | Float64Array> = { ...params };
  for (const [name, field] of Object.entries(spatialParameters ?? {}))
    cellParams[name] = evaluateSpatialParameterField(field, grid, `gradient.profile`);
  const system = createReactionSystemFromKinetics(compiled);
  // The solver takes ρ at the mean of given fields (simulate.ts), so the plan does too.
  const rho = computeReactionStiffness(
    system,
    start ? start.plan.speciesMeans : steadyState,
    cellParams,
    grid.cellCount,
  );
  const rule = chooseTimeStep(req.endTimeS, rho, RUN_STIFFNESS_SAFETY, req.dtS ?? null);
  if (req.timeStepping === "adaptive" && (req.scheme ?? "etd2") !== "etd2")
    failOption(
      "timeStepping",
      `timeStepping: adaptive steps need the scheme etd2 (ETD2RK with an embedded ETD1 error estimate); ${req.scheme} takes fixed steps.`,
    );
  if (rule.steps > SIMULATION_LIMITS.maxSteps)
    failOption("dtS", `endTimeS / dtS needs ${rule.steps} steps; the limit is ${SIMULATION_LIMITS.maxSteps}.`);
  if (req.dtS !== undefined && req.dtS > rule.stiffnessLimitS) {
    warnings.push(
      `dtS = ${req.dtS} is above the stiffness limit ${RUN_STIFFNESS_SAFETY}/ρ = ${rule.stiffnessLimitS.toPrecision(4)} of the explicit reaction step (ρ = ${rho.toPrecision(4)} per time unit); the run uses ${rule.dtS.toPrecision(4)}.`,
    );
  }
  const n = compiled.species.length;
  const work = grid.cellCount * n * rule.steps;
  if (work > RUN_WORK_LIMIT) {
    failOption(
      "grid.cells",
      `grid.cells: ${grid.cellCount} cells × ${n} species × ${rule.steps} steps = ${work} cell-steps; one run may take at most ${RUN_WORK_LIMIT} (256² cells × 2 species × 20000 steps, about ${Math.round(estimateSolverSeconds(RUN_WORK_LIMIT, context.threads))} s on this server). Use fewer cells or a shorter endTimeS.`,
    );
  }
  const snapshotCount = req.snapshots;
  if (grid.cellCount * n * snapshotCount > RUN_SNAPSHOT_VALUES_LIMIT) {
    failOption(
      "snapshots",
      `snapshots: ${snapshotCount} snapshots of ${grid.cellCount} cells × ${n} species keep ${grid.cellCount * n * snapshotCount} values; the limit is ${RUN_SNAPSHOT_VALUES_LIMIT}. Ask for fewer snapshots or fewer cells.`,
    );
  }
  return planRunTail(state, context, { diffusion, spatialParameters, gradientPrediction, rho, rule, work, warnings });
}
