/** The last part of planRun (plan-run.ts): the solver's gradient field, RUN.json and the plan shown. */
import type { GradientShape } from "../stability";
import {
  estimateSolverSeconds,
  type RunPlan,
  type RunPlanContext,
  type RunSpec,
  type RunSteadyState,
} from "./run-plan";
import type { SpatialParameterField } from "./spatial-parameters";
import type { TimeStepRule } from "./step-size";
import { STEP_CONTROL, STEP_RULE_TEXT } from "./step-control";

/** The gradient as the solver takes it: linear and table forms as given, positions along x. */
export function toSolverField(shape: GradientShape, sampled: { x: number; value: number }[]): SpatialParameterField {
  if (shape.kind === "linear") return { kind: "linear", axis: "x", fromValue: shape.from, toValue: shape.to };
  if (shape.kind === "table") return { kind: "table", axis: "x", positionsUm: shape.positions, values: shape.values };
  // The exponential form (with its floor) is taken exactly as the kinetics page evaluates it, at 101 points.
  return { kind: "table", axis: "x", positionsUm: sampled.map((s) => s.x), values: sampled.map((s) => s.value) };
}

/** What planRun decided, for the spec and the plan. */
export interface RunDecisions {
  diffusion: RunPlan["diffusion"];
  spatialParameters: Record<string, SpatialParameterField> | undefined;
  gradientPrediction: RunPlan["gradientPrediction"];
  rho: number;
  rule: TimeStepRule;
  work: number;
  warnings: string[];
}

/** Assembles RUN.json and the plan from the checked request and the decisions. */
export function planRunTail(
  state: RunSteadyState,
  context: RunPlanContext,
  d: RunDecisions,
): { spec: RunSpec; plan: RunPlan } {
  const { request: req, grid, dispersion: r, steadyState, params, dimensional } = state;
  const { start, seed } = context;
  const compiled = req.kinetics;
  const snapshotCount = req.snapshots;
  const snapshotTimesS = Array.from({ length: snapshotCount }, (_, i) =>
    i === snapshotCount - 1 ? req.endTimeS : (req.endTimeS * i) / (snapshotCount - 1),
  );
  const lengthFactor = dimensional ? 1 : (req.lengthScaleUm ?? null);
  const scheme = req.scheme ?? "etd2";
  // Adaptive steps are the default wherever the scheme allows them (ETD2RK needs etd2).
  const adaptive = scheme === "etd2" && req.timeStepping !== "fixed";
  const tolerance = req.tolerance ?? STEP_CONTROL.tolerance;
  const stopWhenStationary = req.stopWhenStationary ?? true;
  // The solver's defaults (simulate.ts): window 10/ρ, tolerance 1e-5·max(ρ, 1/endTimeS).
  const windowS = d.rho > 0 ? 10 / d.rho : req.endTimeS / 20;
  const stationarityTol = 1e-5 * Math.max(d.rho, 1 / req.endTimeS);
  const spec: RunSpec = {
    kinetics: context.kineticsSource,
    parameters: params,
    ...(d.spatialParameters ? { spatialParameters: d.spatialParameters } : {}),
    grid: { lengthUm: [...req.grid.lengthUm], cells: [...req.grid.cells], boundary: grid.boundary },
    endTimeS: req.endTimeS,
    ...(req.dtS !== undefined ? { dtS: req.dtS } : {}),
    scheme,
    ...(adaptive ? { adaptive: { tolerance } } : {}),
    initial: start
      ? { fieldFiles: start.fieldFiles, fromRun: start.fromRun, noiseAmplitude: req.noiseAmplitude ?? 0, seed }
      : { steadyState, ...(req.noiseAmplitude !== undefined ? { noiseAmplitude: req.noiseAmplitude } : {}), seed },
    stopWhenStationary,
    snapshotTimesS,
    ...(!dimensional && (req.lengthScaleUm || req.timeScaleS)
      ? { scales: { lengthScaleUm: req.lengthScaleUm, timeScaleS: req.timeScaleS } }
      : {}),
  };
  const plan: RunPlan = {
    species: [...compiled.species],
    units: req.units,
    lengthUnit: lengthFactor ? "µm" : "model length",
    timeUnit: dimensional || req.timeScaleS ? "s" : "model time",
    lengthFactor,
    timeFactor: dimensional ? 1 : (req.timeScaleS ?? null),
    steadyState,
    diffusion: d.diffusion,
    dtS: d.rule.dtS,
    steps: d.rule.steps,
    adaptive: adaptive ? { tolerance, rule: STEP_RULE_TEXT } : null,
    stationarity: `${stopWhenStationary ? "stops" : "does not stop"} when ‖c(t) − c(t − W)‖₂ / (‖c(t)‖₂ · W) < ${Number(stationarityTol.toPrecision(3))} per time unit, over windows W = ${Number(windowS.toPrecision(3))} time units (10/ρ) of simulated time`,
    spectralRadiusPerS: d.rho,
    stiffnessLimitS: d.rule.stiffnessLimitS,
    workCellSteps: d.work,
    estimatedCpuS: estimateSolverSeconds(d.work, context.threads),
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
    gradientPrediction: d.gradientPrediction,
    fromFit: context.fromFit,
    startFrom: start?.plan ?? null,
    warnings: d.warnings,
  };
  return { spec, plan };
}
