"use client";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/ui/data-table";
import { LongName } from "@/components/ui/long-name";
import { useLiveJobs } from "@/lib/client/use-live-jobs";
import { Badge, EmptyState } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import type { FitSummaryDto } from "@/lib/server/fits/fits";
import { FIT_STATUS_TONE, FIT_STATUS_WORDS, VERDICT_TONE } from "./fit-format";

/** The jobs whose status this list shows: it updates while they run and when they end. */
const FIT_JOBS = ["fit", "fit-comparison"] as const;

export function FitsList({
  labId,
  canFit,
  canSimulate = false,
}: {
  labId: string;
  canFit: boolean;
  /** Runs may be started: a finished comparison offers its best-ranked kinetics to a verification run. */
  canSimulate?: boolean;
}) {
  const live = useLiveJobs(labId, FIT_JOBS);
  const columns: ColumnDef<FitSummaryDto, unknown>[] = [
    {
      id: "name",
      header: "Fit",
      cell: ({ row }) => (
        <LongName
          className="font-medium text-moss hover:underline"
          href={`/labs/${labId}/fits/${row.original.id}`}
          text={row.original.name}
        />
      ),
    },
    {
      id: "status",
      header: "Status",
      cell: ({ row }) => (
        <Badge tone={FIT_STATUS_TONE[row.original.status]}>
          {FIT_STATUS_WORDS[row.original.status]}
          {row.original.status === "running" ? ` ${Math.round(row.original.progress * 100)} %` : ""}
        </Badge>
      ),
    },
    {
      id: "kinetics",
      header: "Kinetics",
      enableSorting: false,
      cell: ({ row }) => <span className="text-sm">{row.original.kinetics.join(" vs ")}</span>,
    },
    {
      id: "data",
      header: "Data",
      enableSorting: false,
      cell: ({ row }) => (
        <span className="text-sm text-ink-soft">
          <span className="num">{row.original.n}</span> measurements · {row.original.conditions.join(", ")}
        </span>
      ),
    },
    {
      id: "verdict",
      header: "Verdict",
      enableSorting: false,
      cell: ({ row }) =>
        row.original.verdict ? (
          <span>
            {row.original.kind === "comparison" && (
              <span className="mr-1 text-xs text-ink-soft">best: {row.original.best} —</span>
            )}
            <Badge tone={VERDICT_TONE[row.original.verdict] ?? "plain"}>{row.original.verdict}</Badge>
            {canSimulate && row.original.kind === "comparison" && row.original.best && (
              <Link
                className="ml-2 text-xs text-moss hover:underline"
                href={`/labs/${labId}/runs/new?${new URLSearchParams({ fit: row.original.id, model: row.original.best, condition: row.original.conditions[0] ?? "" })}`}
                data-testid="list-verify-best"
              >
                Verify the best by simulation
              </Link>
            )}
          </span>
        ) : (
          <span className="text-ink-soft">{row.original.error ?? "—"}</span>
        ),
    },
    {
      id: "createdAt",
      header: "Started",
      cell: ({ row }) => (
        <span className="text-ink-soft">
          <span className="num">{formatDateTime(row.original.createdAt)}</span>
          <br />
          {row.original.createdByEmail}
        </span>
      ),
    },
  ];
  return (
    <DataTable<FitSummaryDto>
      refreshKey={live.version}
      url={`/api/v1/labs/${labId}/fits`}
      columns={columns}
      defaultSort={{ id: "createdAt", desc: true }}
      filterPlaceholder="Filter by name…"
      testId="fits-table"
      empty={
        <EmptyState title="No fits yet.">
          {canFit ? (
            <>
              Start one with{" "}
              <Link className="text-moss hover:underline" href={`/labs/${labId}/fits/new`}>
                New fit
              </Link>
              : choose readouts grouped by condition, a kinetics, and which parameters to free.
            </>
          ) : (
            "When a lab member fits a kinetics to the lab's readouts, it appears here."
          )}
        </EmptyState>
      }
    />
  );
}
