"use client";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { formatSig } from "../../readouts/readout-format";

/** The provenance of adaptive steps: tolerance and rule as planned, the steps as taken. */
export function RunAdaptiveSteps({ r }: { r: RunDetailDto }) {
  const p = r.plan,
    tf = p.timeFactor ?? 1,
    unit = p.timeUnit;
  const taken = r.result?.adaptive;
  return (
    <>
      adaptive steps, local error tolerance {r.spec.adaptive!.tolerance}
      {r.spec.dtS !== undefined ? `, at most ${formatSig(r.spec.dtS * tf, 4)} ${unit}` : ""}; first step{" "}
      {formatSig(p.dtS * tf, 4)} {unit} (0.1/ρ, ρ = {formatSig(p.spectralRadiusPerS, 4)} per time unit)
      {taken
        ? `; ${taken.acceptedSteps} steps taken (${taken.rejectedSteps} rejected), from ${formatSig(taken.smallestStepS * tf, 3)} to ${formatSig(taken.largestStepS * tf, 3)} ${unit}, last ${formatSig(taken.lastStepS * tf, 3)} ${unit}`
        : ""}
      {p.adaptive && <span className="mt-1 block text-xs text-ink-soft">Step rule: {p.adaptive.rule}</span>}
    </>
  );
}
