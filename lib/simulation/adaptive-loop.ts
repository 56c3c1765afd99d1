/**
 * The step loop with adaptive steps: ETD2RK with its embedded ETD1 solution as the error
 * estimate and the controller of step-control.ts. Steps land exactly on snapshot times and on
 * endTimeS; stationarity is measured over windows of simulated time (not of steps).
 */
import { StageMode, type SpeciesBuffers } from "./diffusion-stage";
import type { DiffusionExecutor } from "./executor";
import { computeRelativeChangeRate } from "./field-stats";
import type { SimulationOptions } from "./options";
import type { ReactionParams, ReactionSystem } from "./reaction-system";
import type { AdaptiveStepSummary, BlowUpInfo, Snapshot, SimulationStopReason } from "./result";
import { computeStepError, proposeStep, roundStepDown, STEP_CONTROL, STEP_RULE_TEXT } from "./step-control";

/** What the adaptive loop needs from the set-up in simulate.ts. */
export interface AdaptiveLoopInput {
  system: ReactionSystem;
  params: ReactionParams;
  options: SimulationOptions;
  executor: DiffusionExecutor;
  buffers: SpeciesBuffers[];
  /** Copies the stepped fields into species coordinates (cross-diffusion) or plain copies. */
  physical: (fields: Float64Array[]) => Float64Array[];
  selectStep: (stepS: number) => void;
  firstStepS: number;
  maxSteps: number;
  tol: number;
  windowS: number;
}

export interface LoopOutcome {
  timeS: number;
  steps: number;
  reason: SimulationStopReason;
  blowUp: BlowUpInfo | null;
  /** Set when the step size fell below its floor: the words for the stop message. */
  blowUpWhat: string | null;
  lastRate: number | null;
  snapshots: Snapshot[];
  adaptive: AdaptiveStepSummary;
}

export function runAdaptiveLoop(input: AdaptiveLoopInput): LoopOutcome {
  const { system, params, options, executor, buffers, physical, selectStep, tol, windowS } = input;
  const n = buffers.length;
  const endS = options.endTimeS,
    eps = 1e-12 * endS;
  const tolerance = options.adaptive?.tolerance ?? STEP_CONTROL.tolerance;
  const maxStepS = options.dtS ?? Infinity;
  // Below this the controller cannot follow the solution (HNW §II.4 codes stop the same way).
  const minStepS = 1e-10 * endS;
  const blowUpAbs = options.blowUpAbs ?? 1e12;
  const snapTimes = options.snapshotTimesS ?? [];
  const snapshots: Snapshot[] = [];
  const views = [buffers.map((b) => b.fields[0]), buffers.map((b) => b.fields[1])];
  const stage = buffers.map((b) => b.stage!);
  const st = options.stationarity ?? {};
  const minTime = st.minTimeS ?? 0;
  let ref = physical(views[0]),
    refTimeS = 0;
  let t = 0,
    steps = 0,
    rejected = 0,
    nextSnap = 0,
    nextProgress = 0.01,
    lastRate: number | null = null,
    afterRejection = false,
    previousErr: number | null = null,
    h = roundStepDown(Math.min(input.firstStepS, maxStepS));
  const summary = { smallest: Infinity, largest: 0, last: 0 };
  let reason: SimulationStopReason = "end-time";
  let blowUp: BlowUpInfo | null = null,
    blowUpWhat: string | null = null;
  const takeSnapshots = () => {
    while (nextSnap < snapTimes.length && t >= snapTimes[nextSnap] - eps) {
      snapshots.push({ requestedTimeS: snapTimes[nextSnap++], timeS: t, step: steps, fields: physical(views[0]) });
    }
  };
  takeSnapshots();

  while (t < endS - eps) {
    if (options.signal?.aborted || options.shouldStop?.()) {
      reason = "cancelled";
      break;
    }
    if (steps + rejected >= input.maxSteps) {
      blowUp = { step: steps + 1, timeS: t + h, lastGoodTimeS: t, maxAbs: NaN };
      blowUpWhat = `the adaptive steps needed more than ${input.maxSteps} attempts`;
      reason = "blow-up";
      break;
    }
    // Land exactly on the next snapshot time or the end (a step up to 1 % longer avoids a sliver).
    const target = nextSnap < snapTimes.length ? Math.min(snapTimes[nextSnap], endS) : endS;
    const landing = t + 1.01 * h >= target - eps;
    const stepS = landing ? target - t : h;
    selectStep(stepS);
    const c = views[0],
      a = views[1];
    // After a rejection R̂(c) is still in R̂prev: only the stage is redone.
    if (!afterRejection) system.evaluate(c, params, a);
    const m1 = executor.run(afterRejection ? StageMode.RkRetry : StageMode.RkPredict, 1);
    system.evaluate(a, params, stage);
    const m2 = executor.run(StageMode.RkCorrect, 1);
    const err = Number.isFinite(m1) && Number.isFinite(m2) ? computeStepError(c, stage, a, tolerance) : NaN;
    if (!(err <= 1)) {
      rejected++;
      afterRejection = true;
      h = roundStepDown(proposeStep(stepS, err, true));
      if (!(h >= minStepS)) {
        blowUp = { step: steps + 1, timeS: t + stepS, lastGoodTimeS: t, maxAbs: Number.isFinite(m2) ? m2 : NaN };
        blowUpWhat = `the step size fell below ${minStepS.toExponential(2)} s with the local error still above the tolerance ${tolerance}`;
        reason = "blow-up";
        break;
      }
      continue;
    }
    if (!(m2 <= blowUpAbs)) {
      blowUp = { step: steps + 1, timeS: t + stepS, lastGoodTimeS: t, maxAbs: m2 };
      reason = "blow-up";
      break;
    }
    for (let s = 0; s < n; s++) {
      buffers[s].chat!.set(buffers[s].ahat!);
      c[s].set(stage[s]);
    }
    t = landing ? target : t + stepS;
    steps++;
    summary.smallest = Math.min(summary.smallest, stepS);
    summary.largest = Math.max(summary.largest, stepS);
    summary.last = stepS;
    // After a step shortened to land on a time, keep the longer step the controller had.
    const proposed = proposeStep(stepS, err, afterRejection, previousErr);
    previousErr = err;
    h = roundStepDown(Math.min(landing ? Math.max(h, proposed) : proposed, maxStepS));
    afterRejection = false;
    takeSnapshots();
    if (t - refTimeS >= windowS - eps) {
      const now = physical(views[0]);
      lastRate = computeRelativeChangeRate(now, ref, t - refTimeS);
      ref = now;
      refTimeS = t;
      if (options.stopWhenStationary && lastRate < tol && t >= minTime) {
        reason = "stationary";
        break;
      }
    }
    const every = options.progressEverySteps;
    const due = every ? steps % every === 0 : t / endS >= nextProgress;
    if (options.onProgress && due && t < endS - eps) {
      while (nextProgress <= t / endS) nextProgress += 0.01;
      options.onProgress({ timeS: t, fraction: t / endS, percent: (100 * t) / endS, steps, dtS: stepS });
    }
  }
  options.onProgress?.({ timeS: t, fraction: t / endS, percent: (100 * t) / endS, steps, dtS: summary.last });
  return {
    timeS: t,
    steps,
    reason,
    blowUp,
    blowUpWhat,
    lastRate,
    snapshots,
    adaptive: {
      tolerance,
      rule: STEP_RULE_TEXT,
      acceptedSteps: steps,
      rejectedSteps: rejected,
      firstStepS: input.firstStepS,
      smallestStepS: steps > 0 ? summary.smallest : 0,
      largestStepS: summary.largest,
      lastStepS: summary.last,
    },
  };
}
