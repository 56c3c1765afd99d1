"use client";
/** A reopened batch: its summary, polled while readouts still run, and its CSV. */
import useSWR from "swr";
import { buttonClass } from "@/components/ui/button";
import { EmptyState, Panel } from "@/components/ui/panel";
import { fetchJson } from "@/lib/client/api";
import type { BatchSummary } from "@/lib/server/batches/summary";
import { BatchSummaryTable, tableRowOf } from "../batch-summary-table";

export function BatchView({ labId, initial }: { labId: string; initial: BatchSummary }) {
  const { data } = useSWR<BatchSummary>(`/api/v1/labs/${labId}/batches/${initial.id}`, fetchJson, {
    fallbackData: initial,
    refreshInterval: (s) => (s && s.done ? 0 : 1500),
  });
  const s = data ?? initial;
  return (
    <Panel
      title="Files"
      actions={
        <a
          className={buttonClass("secondary", "sm")}
          href={`/api/v1/labs/${labId}/batches/${s.id}/csv`}
          data-testid="batch-csv"
        >
          Download CSV
        </a>
      }
    >
      <p className="mb-3 text-sm" data-testid="batch-summary">
        {s.done
          ? `${s.rows.length} file(s): ${s.counts.read} read, ${s.counts["no-period"]} without a significant period, ${s.counts.failed} failed.`
          : `${s.rows.length} file(s); reading… ${s.counts.queued + s.counts.reading} still to finish.`}
      </p>
      {s.rows.length ? (
        <BatchSummaryTable labId={labId} rows={s.rows.map((r, i) => tableRowOf(r, `${i}`))} />
      ) : (
        <EmptyState title="No files in this batch yet.">
          Files sent to this batch appear here as they are stored.
        </EmptyState>
      )}
    </Panel>
  );
}
