"use client";
import Link from "next/link";
import useSWR from "swr";
import { useState } from "react";
import { FieldImage } from "@/components/charts/field-image";
import { RunScrubber } from "@/components/charts/run-scrubber";
import { Notice } from "@/components/ui/notice";
import { Badge, Panel } from "@/components/ui/panel";
import { ApiError, fetchJson, sendJson } from "@/lib/client/api";
import type { SpectrumProducts } from "@/lib/server/readouts/result";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { formatSig, STATUS_TONE, STATUS_WORDS } from "../../readouts/readout-format";
import { STOP_WORDS } from "../run-format";
import { continueHref } from "./continue-href";
import { RunComparisonPanel } from "./run-comparison-panel";
import { RunProgressPanel } from "./run-progress-panel";
import { RunProvenance } from "./run-provenance";
import { RunSpectrumPanels } from "./run-spectrum-panels";

const active = (s: string) => s === "queued" || s === "running";

export function RunView({ labId, initial, canStart }: { labId: string; initial: RunDetailDto; canStart: boolean }) {
  const url = `/api/v1/labs/${labId}/runs/${initial.id}`;
  const { data, mutate } = useSWR<RunDetailDto>(url, fetchJson, {
    fallbackData: initial,
    refreshInterval: (d) => (active((d ?? initial).status) ? 700 : 0),
  });
  const r = data ?? initial;
  const [cancelError, setCancelError] = useState<string | null>(null);
  const res = r.result,
    plan = r.plan;
  const { data: spectrum } = useSWR<SpectrumProducts>(r.files["spectrum.json"] ?? null, fetchJson);
  const lf = plan.lengthFactor ?? 1,
    unit = plan.lengthUnit,
    tf = plan.timeFactor ?? 1;
  const oneD = r.spec.grid.cells.length === 1;
  const w = res?.readout?.wavelength;
  async function cancel() {
    try {
      await sendJson("POST", `${url}/cancel`);
      await mutate();
    } catch (err) {
      setCancelError(err instanceof ApiError ? err.message : String(err));
    }
  }
  return (
    <div className="space-y-5" data-testid="run-view">
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <Badge tone={res?.stopReason === "blow-up" ? "brick" : STATUS_TONE[r.status]}>
          <span data-testid="run-status">
            {r.status === "succeeded" && res ? STOP_WORDS[res.stopReason] : STATUS_WORDS[r.status]}
          </span>
        </Badge>
        <span className="text-ink-soft">
          Seed{" "}
          <span className="num text-ink" data-testid="run-seed">
            {r.seed}
          </span>
        </span>
        <span className="text-ink-soft">
          Step{" "}
          <span className="num text-ink">
            {formatSig(plan.dtS * tf, 4)} {plan.timeUnit}
          </span>{" "}
          × <span className="num text-ink">{plan.steps}</span> steps
        </span>
        {canStart && !active(r.status) && (
          <Link
            className="ml-auto text-moss hover:underline"
            href={`/labs/${labId}/runs/new?change=${r.id}`}
            data-testid="change-run"
          >
            Change and run again →
          </Link>
        )}
        {r.status === "succeeded" && canStart && (
          <Link className="text-moss hover:underline" href={continueHref(labId, r)} data-testid="continue-run">
            Start a run from this pattern →
          </Link>
        )}
      </div>
      {plan.warnings.map((x) => (
        <Notice key={x} tone="warning">
          {x}
        </Notice>
      ))}
      {active(r.status) && <RunProgressPanel r={r} onCancel={cancel} cancelError={cancelError} />}
      {(r.status === "failed" || r.status === "cancelled") && (
        <Notice tone="error" testId="run-error">
          This run {r.status === "failed" ? "failed" : "was cancelled"}: {r.error ?? "no reason was recorded"}. Nothing
          was stored; start a new run.
        </Notice>
      )}
      {res?.stopReason === "blow-up" && (
        <Notice tone="error" testId="run-blow-up">
          {res.message} The images and numbers below show that last good state.
        </Notice>
      )}
      {res && (
        <>
          <RunComparisonPanel labId={labId} r={r} res={res} />
          <Panel title="Snapshots">
            <RunScrubber
              snapshots={res.snapshots}
              species={plan.species}
              imageUrl={(i, s) => r.files[`snapshot-${i}-${s}.png`]}
              width={r.spec.grid.lengthUm[0] * lf}
              lengthUnit={unit}
              timeFactor={tf}
              timeUnit={plan.timeUnit}
              oneDimensional={oneD}
            />
          </Panel>
          <Panel title={`Final fields at t = ${formatSig(res.timeS * tf, 4)} ${plan.timeUnit}`}>
            <div className="grid gap-4 md:grid-cols-2">
              {plan.species.map(
                (s, i) =>
                  r.files[`final-${i}.png`] && (
                    <FieldImage
                      key={s}
                      src={r.files[`final-${i}.png`]}
                      alt={`final ${s}`}
                      width={r.spec.grid.lengthUm[0] * lf}
                      unit={unit}
                      min={res.fields[i].min}
                      max={res.fields[i].max}
                      species={s}
                      oneDimensional={oneD}
                      testId={`final-${i}`}
                    />
                  ),
              )}
            </div>
          </Panel>
          {res.readout && w && <RunSpectrumPanels r={r} readout={res.readout} spectrum={spectrum} />}
        </>
      )}
      <RunProvenance r={r} labId={labId} />
    </div>
  );
}
