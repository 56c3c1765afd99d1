"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/ui/data-table";
import { LongName } from "@/components/ui/long-name";
import { useLiveJobs } from "@/lib/client/use-live-jobs";
import { Badge, EmptyState } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import type { RunDto } from "@/lib/server/runs/types";
import { STATUS_TONE, STATUS_WORDS } from "../readouts/readout-format";
import { STOP_WORDS, withUnit } from "./run-format";

/** The jobs whose status this list shows: it updates while they run and when they end. */
const RUN_JOBS = ["simulation"] as const;

export function RunsList({ labId, canRun }: { labId: string; canRun: boolean }) {
  const live = useLiveJobs(labId, RUN_JOBS);
  const columns: ColumnDef<RunDto, unknown>[] = [
    {
      id: "name",
      header: "Run",
      enableSorting: false,
      cell: ({ row }) => (
        <LongName
          className="font-medium text-moss hover:underline"
          href={`/labs/${labId}/runs/${row.original.id}`}
          text={row.original.name}
        />
      ),
    },
    {
      id: "kineticsName",
      header: "Kinetics",
      cell: ({ row }) => (
        <span>
          {row.original.kinetics.name}
          {row.original.kinetics.version ? (
            <span className="num text-ink-soft"> v{row.original.kinetics.version}</span>
          ) : null}
        </span>
      ),
    },
    {
      id: "status",
      header: "Status",
      cell: ({ row }) => (
        <Badge tone={row.original.stopReason === "blow-up" ? "brick" : STATUS_TONE[row.original.status]}>
          {row.original.status === "succeeded" && row.original.stopReason
            ? STOP_WORDS[row.original.stopReason]
            : STATUS_WORDS[row.original.status]}
          {row.original.status === "running" ? ` ${Math.round(row.original.progress * 100)} %` : ""}
        </Badge>
      ),
    },
    {
      id: "wavelength",
      header: () => <span className="normal-case">Simulated λ</span>,
      enableSorting: false,
      cell: ({ row }) => (
        <span className="num text-moss">
          {withUnit(row.original.wavelength, row.original.lengthUnit, row.original.uncertainty)}
        </span>
      ),
    },
    {
      id: "predicted",
      header: () => <span className="normal-case">Predicted 2π/k*</span>,
      enableSorting: false,
      cell: ({ row }) => (
        <span className="num text-iris">{withUnit(row.original.predictedWavelength, row.original.lengthUnit)}</span>
      ),
    },
    {
      id: "grid",
      header: "Grid",
      enableSorting: false,
      cell: ({ row }) => <span className="num text-xs text-ink-soft">{row.original.gridLabel}</span>,
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
    <DataTable<RunDto>
      refreshKey={live.version}
      url={`/api/v1/labs/${labId}/runs`}
      columns={columns}
      defaultSort={{ id: "createdAt", desc: true }}
      filterPlaceholder="Filter by name or kinetics…"
      testId="runs-table"
      empty={
        <EmptyState title="No verification runs yet.">
          {canRun
            ? "Open a kinetics (Kinetics → one kinetics) and choose “Simulate with these parameters”, or start one with “New run”."
            : "Modellers and the lab manager start runs from a kinetics page; they will be listed here."}
        </EmptyState>
      }
    />
  );
}
