"use client";
/** The panel shown while a run is queued or running: progress bar, note, estimated solver time, cancel. */
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { formatSig } from "../../readouts/readout-format";

export function RunProgressPanel({
  r,
  onCancel,
  cancelError,
}: {
  r: RunDetailDto;
  onCancel: () => void;
  cancelError: string | null;
}) {
  const plan = r.plan;
  return (
    <Panel
      title="Simulating…"
      actions={
        r.canCancel ? (
          <Button variant="secondary" size="sm" onClick={onCancel} data-testid="cancel-run">
            Cancel
          </Button>
        ) : null
      }
    >
      <div
        className="h-2 w-full max-w-md overflow-hidden rounded bg-paper-deep"
        role="progressbar"
        aria-valuenow={Math.round(r.progress * 100)}
        aria-valuemin={0}
        aria-valuemax={100}
      >
        <div className="h-full bg-moss transition-all" style={{ width: `${Math.round(r.progress * 100)}%` }} />
      </div>
      <p className="mt-2 text-sm text-ink-soft" data-testid="run-progress">
        <span className="num">{Math.round(r.progress * 100)} %</span>
        {r.progressNote
          ? ` · ${r.progressNote}`
          : r.status === "queued"
            ? " · waiting for earlier jobs"
            : " · starting the solver"}
      </p>
      <p className="mt-1 text-xs text-ink-soft">
        Estimated solver time <span className="num">{formatSig(plan.estimatedCpuS, 2)} s</span> for{" "}
        <span className="num">{plan.workCellSteps.toLocaleString("en")}</span> cell-species-steps, plus a few seconds to
        start.
      </p>
      {cancelError && <Notice tone="error">{cancelError}</Notice>}
    </Panel>
  );
}
