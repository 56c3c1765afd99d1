import { createSpectralBasis } from "./spectral-basis";
import { StageMode, type SpeciesBuffers } from "./diffusion-stage";
import { failOption } from "./errors";
import {
  createModeReactionSystem,
  decomposeDiffusion,
  isDiagonalMatrix,
  mixSpecies,
  mixSpeciesInPlace,
  type DiffusionModes,
} from "./cross-diffusion";
import { createSerialExecutor } from "./executor";
import { computeFieldStats, computeRelativeChangeRate } from "./field-stats";
import type { Grid } from "./grid";
import { fillInitialState } from "./initial-state";
import { SIMULATION_LIMITS } from "./limits";
import { resolveSimulationOptions, type SimulationOptions } from "./options";
import type { ReactionParams, ReactionSystem } from "./reaction-system";
import type { AdaptiveStepSummary, BlowUpInfo, SimulationResult, Snapshot, SimulationStopReason } from "./result";
import { stopMessage } from "./stop-message";
import { coefficientNames, fillSchemeCoefficients, type SpeciesCoefficients } from "./schemes";
import { chooseTimeStep, computeReactionStiffness } from "./step-size";
import { runAdaptiveLoop } from "./adaptive-loop";
import { createCoefficientCache } from "./step-control";

/**
 * Simulates ∂c/∂t = R(c) + D∇²c on a zero-flux interval or rectangle with a semi-implicit
 * spectral scheme (diffusion per cosine mode, reactions explicit; see schemes.ts and README).
 * Synchronous; progress, cancellation and snapshots are handled between steps.
 */
export function simulateReactionDiffusion(system: ReactionSystem, options: SimulationOptions): SimulationResult {
  const { grid, params } = resolveSimulationOptions(options, system.species);
  const executor = options.executor ?? createSerialExecutor();
  try {
    return run(system, options, grid, params, executor);
  } finally {
    if (!options.executor) executor.dispose();
  }
}

/** Diagonal diffusivities, or the mode decomposition of a cross-diffusion matrix. */
function resolveDiffusion(d: SimulationOptions["diffusionUm2PerS"]): {
  diagonal: number[];
  modes: DiffusionModes | null;
} {
  if (!Array.isArray(d[0])) return { diagonal: [...(d as readonly number[])], modes: null };
  const m = d as readonly (readonly number[])[];
  if (isDiagonalMatrix(m)) return { diagonal: m.map((row, i) => row[i]), modes: null };
  const modes = decomposeDiffusion(m);
  return { diagonal: modes.diffusivities, modes };
}

function run(
  physicalSystem: ReactionSystem,
  options: SimulationOptions,
  grid: Grid,
  params: ReactionParams,
  executor: NonNullable<SimulationOptions["executor"]>,
): SimulationResult {
  const n = physicalSystem.species,
    cells = grid.cellCount,
    scheme = options.scheme ?? "etd2",
    adaptive = options.adaptive !== undefined;
  const { diagonal, modes } = resolveDiffusion(options.diffusionUm2PerS);
  // With cross-diffusion the solver steps the mode coordinates w = V⁻¹c (cross-diffusion.ts).
  const system = modes ? createModeReactionSystem(physicalSystem, modes, cells) : physicalSystem;
  const buffers: SpeciesBuffers[] = [];
  for (let s = 0; s < n; s++) {
    buffers.push({
      fields: [executor.allocate(cells), executor.allocate(cells)],
      spec: executor.allocate(cells),
      chat: scheme === "etd2" ? executor.allocate(cells) : undefined,
      rprev: scheme === "etd2" ? executor.allocate(cells) : undefined,
      ahat: adaptive ? executor.allocate(cells) : undefined,
      stage: adaptive ? executor.allocate(cells) : undefined,
    });
  }
  const views = [buffers.map((b) => b.fields[0]), buffers.map((b) => b.fields[1])];
  const seed = fillInitialState(options.initial, views[0]);
  const reference =
    options.initial.kind === "steady-state-noise"
      ? [...options.initial.steadyState]
      : views[0].map((f) => computeFieldStats(f).mean);

  // ρ is the same in mode coordinates (V⁻¹JV is similar to J).
  const rho = computeReactionStiffness(physicalSystem, reference, params, cells);
  const rule = chooseTimeStep(options.endTimeS, rho, options.stiffnessSafety ?? 0.1, options.dtS ?? null);
  if (rule.steps > SIMULATION_LIMITS.maxSteps) {
    failOption("dtS", `endTimeS / dtS needs ${rule.steps} steps; the limit is ${SIMULATION_LIMITS.maxSteps}.`);
  }
  const h = rule.dtS;
  const basis = createSpectralBasis(grid);
  const names = coefficientNames(scheme, adaptive);
  const coefficients: SpeciesCoefficients[] = buffers.map((_, s) => {
    const c: SpeciesCoefficients = {};
    for (const name of names) c[name] = executor.allocate(cells);
    if (!adaptive) fillSchemeCoefficients(scheme, basis.k2PerUm2, diagonal[s], h, c);
    return c;
  });
  // Adaptive steps: the φ-functions of each step size, cached (step-control.ts).
  const cache = adaptive ? createCoefficientCache(scheme, basis.k2PerUm2, diagonal, names, coefficients) : null;
  if (modes) mixSpeciesInPlace(modes.toModes, views[0]);
  if (scheme === "etd2") buffers.forEach((b) => basis.forward(b.fields[0], b.chat!));
  executor.prepare({ grid, buffers, coefficients });

  const st = options.stationarity ?? {};
  const tol = st.tolerancePerS ?? 1e-5 * Math.max(rho, 1 / options.endTimeS);
  const windowAskedS = st.windowS ?? (rho > 0 ? 10 / rho : options.endTimeS / 20);
  const windowSteps = Math.max(1, Math.round(windowAskedS / h));
  const minTime = st.minTimeS ?? 0;
  // Copies of the current state in species coordinates (snapshots, stationarity, result).
  const physical = (fields: Float64Array[]): Float64Array[] => {
    if (!modes) return fields.map((f) => Float64Array.from(f));
    const out = fields.map((f) => new Float64Array(f.length));
    mixSpecies(modes.toSpecies, fields, out);
    return out;
  };
  if (cache) {
    const out = runAdaptiveLoop({
      system,
      params,
      options,
      executor,
      buffers,
      physical,
      selectStep: cache.select,
      firstStepS: h,
      maxSteps: SIMULATION_LIMITS.maxSteps,
      tol,
      windowS: windowAskedS,
    });
    const fields = physical(views[0]);
    return assembleResult(system, options, {
      grid,
      scheme,
      fields,
      timeS: out.timeS,
      steps: out.steps,
      timeStep: rule,
      reason: out.reason,
      lastRate: out.lastRate,
      tol,
      windowS: windowAskedS,
      blowUp: out.blowUp,
      blowUpWhat: out.blowUpWhat,
      snapshots: out.snapshots,
      seed,
      adaptive: out.adaptive,
    });
  }
  const ref = physical(views[0]);
  const blowUpAbs = options.blowUpAbs ?? 1e12;
  const snapTimes = options.snapshotTimesS ?? [];
  const snapshots: Snapshot[] = [];
  const progressEvery = options.progressEverySteps ?? Math.ceil(rule.steps / 100);

  let cur: 0 | 1 = 0,
    steps = 0,
    nextSnap = 0,
    lastRate: number | null = null;
  let reason: SimulationStopReason = "end-time";
  let blowUp: BlowUpInfo | null = null;
  const takeSnapshots = () => {
    const t = steps * h;
    while (nextSnap < snapTimes.length && t >= snapTimes[nextSnap] - 1e-9 * h) {
      snapshots.push({ requestedTimeS: snapTimes[nextSnap++], timeS: t, step: steps, fields: physical(views[cur]) });
    }
  };
  takeSnapshots();

  while (steps < rule.steps) {
    if (options.signal?.aborted || options.shouldStop?.()) {
      reason = "cancelled";
      break;
    }
    const c = views[cur],
      w = views[1 - cur];
    system.evaluate(c, params, w);
    if (scheme !== "etd2") {
      for (let s = 0; s < n; s++) {
        const cs = c[s],
          ws = w[s];
        for (let i = 0; i < cells; i++) ws[i] = cs[i] + h * ws[i];
      }
    }
    const mode = scheme !== "etd2" ? StageMode.FirstOrder : steps === 0 ? StageMode.EtdStart : StageMode.Etd2;
    const maxAbs = executor.run(mode, (1 - cur) as 0 | 1);
    if (!(maxAbs <= blowUpAbs)) {
      blowUp = { step: steps + 1, timeS: (steps + 1) * h, lastGoodTimeS: steps * h, maxAbs };
      reason = "blow-up";
      break;
    }
    cur = (1 - cur) as 0 | 1;
    steps++;
    takeSnapshots();
    if (steps % windowSteps === 0) {
      const now = modes ? physical(views[cur]) : views[cur];
      lastRate = computeRelativeChangeRate(now, ref, windowSteps * h);
      ref.forEach((r, s) => r.set(now[s]));
      if (options.stopWhenStationary && lastRate < tol && steps * h >= minTime) {
        reason = "stationary";
        break;
      }
    }
    if (options.onProgress && steps % progressEvery === 0 && steps < rule.steps) {
      options.onProgress({
        timeS: steps * h,
        fraction: steps / rule.steps,
        percent: (100 * steps) / rule.steps,
        steps,
        dtS: h,
      });
    }
  }
  const timeS = steps * h;
  options.onProgress?.({ timeS, fraction: steps / rule.steps, percent: (100 * steps) / rule.steps, steps, dtS: h });
  return assembleResult(system, options, {
    grid,
    scheme,
    fields: physical(views[cur]),
    timeS,
    steps,
    timeStep: rule,
    reason,
    lastRate,
    tol,
    windowS: windowSteps * h,
    blowUp,
    blowUpWhat: null,
    snapshots,
    seed,
    adaptive: null,
  });
}

/** What either step loop ends with. */
interface RunOutcome {
  grid: Grid;
  scheme: SimulationResult["scheme"];
  fields: Float64Array[];
  timeS: number;
  steps: number;
  timeStep: SimulationResult["timeStep"];
  reason: SimulationStopReason;
  lastRate: number | null;
  tol: number;
  windowS: number;
  blowUp: BlowUpInfo | null;
  blowUpWhat: string | null;
  snapshots: Snapshot[];
  seed: string | null;
  adaptive: AdaptiveStepSummary | null;
}

function assembleResult(system: ReactionSystem, options: SimulationOptions, o: RunOutcome): SimulationResult {
  return {
    grid: o.grid,
    speciesNames: Array.from({ length: system.species }, (_, s) => system.speciesNames?.[s] ?? `c${s + 1}`),
    scheme: o.scheme,
    fields: o.fields,
    timeS: o.timeS,
    steps: o.steps,
    timeStep: o.timeStep,
    adaptive: o.adaptive,
    stopReason: o.reason,
    message: stopMessage(o.reason, {
      timeS: o.timeS,
      steps: o.steps,
      endTimeS: options.endTimeS,
      rate: o.lastRate,
      tol: o.tol,
      windowS: o.windowS,
      blowUp: o.blowUp,
      blowUpAbs: options.blowUpAbs ?? 1e12,
      blowUpWhat: o.blowUpWhat,
      adaptive: o.adaptive !== null,
    }),
    stationary: o.lastRate !== null && o.lastRate < o.tol,
    lastChangeRatePerS: o.lastRate,
    stationarityTolerancePerS: o.tol,
    stationarityWindowS: o.windowS,
    blowUp: o.blowUp,
    snapshots: o.snapshots,
    stats: o.fields.map(computeFieldStats),
    seed: o.seed,
  };
}
