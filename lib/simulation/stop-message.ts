/** The one sentence saying why a run stopped. */
import type { BlowUpInfo, SimulationStopReason } from "./result";

export interface MessageFacts {
  timeS: number;
  steps: number;
  endTimeS: number;
  rate: number | null;
  tol: number;
  windowS: number;
  blowUp: BlowUpInfo | null;
  blowUpAbs: number;
  blowUpWhat: string | null;
  adaptive: boolean;
}

export function stopMessage(reason: SimulationStopReason, f: MessageFacts): string {
  if (reason === "end-time") return `Reached endTimeS = ${f.endTimeS} s after ${f.steps} steps.`;
  if (reason === "cancelled") return `Cancelled at t = ${f.timeS} s after ${f.steps} steps.`;
  if (reason === "stationary") {
    return `Stationary at t = ${f.timeS} s: relative change ${f.rate!.toExponential(3)} /s is below ${f.tol.toExponential(3)} /s over a window of ${f.windowS} s.`;
  }
  const b = f.blowUp!;
  const what = f.blowUpWhat
    ? f.blowUpWhat
    : Number.isNaN(b.maxAbs) || !Number.isFinite(b.maxAbs)
      ? "a field value became NaN or infinite"
      : `|c| reached ${b.maxAbs.toExponential(3)}, above blowUpAbs = ${f.blowUpAbs}`;
  return `Blow-up at step ${b.step} (t = ${b.timeS} s): ${what}; the fields are the last good state, at t = ${b.lastGoodTimeS} s. ${f.adaptive ? "Check the parameters." : "Reduce dtS or check the parameters."}`;
}
