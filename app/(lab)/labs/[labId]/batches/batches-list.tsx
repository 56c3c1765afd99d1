"use client";
/** The lab's batches: name, where the files went, how many, who, when. */
import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/ui/data-table";
import { LongName } from "@/components/ui/long-name";
import { useLiveJobs } from "@/lib/client/use-live-jobs";
import { EmptyState, Panel } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import type { BatchDto } from "@/lib/server/batches/batches";

/** The jobs whose status this list shows: it updates while they run and when they end. */
const BATCH_JOBS = ["readout"] as const;

export function BatchesList({ labId }: { labId: string }) {
  const live = useLiveJobs(labId, BATCH_JOBS);
  const columns: ColumnDef<BatchDto, unknown>[] = [
    {
      id: "name",
      header: "Batch",
      cell: ({ row }) => (
        <LongName
          className="font-medium text-moss hover:underline"
          href={`/labs/${labId}/batches/${row.original.id}`}
          text={row.original.name}
        />
      ),
    },
    {
      id: "into",
      header: "Into",
      enableSorting: false,
      cell: ({ row }) =>
        row.original.target === "specimen-per-file"
          ? `study ${row.original.studyName ?? "(deleted)"}, a specimen per file`
          : `specimen ${row.original.specimenLabel ?? "(deleted)"}`,
    },
    {
      id: "files",
      header: "Files",
      enableSorting: false,
      cell: ({ row }) => (
        <span className="num">
          {row.original.fileCount}
          {row.original.rejectedCount ? ` (+${row.original.rejectedCount} refused)` : ""}
        </span>
      ),
    },
    {
      id: "createdAt",
      header: "Started",
      cell: ({ row }) => (
        <span className="text-ink-soft">
          <span className="num">{formatDateTime(row.original.createdAt)}</span>
          {row.original.createdByEmail ? ` · ${row.original.createdByEmail}` : ""}
        </span>
      ),
    },
  ];
  return (
    <Panel>
      <DataTable<BatchDto>
        refreshKey={live.version}
        url={`/api/v1/labs/${labId}/batches`}
        columns={columns}
        defaultSort={{ id: "createdAt", desc: true }}
        filterPlaceholder="Filter by batch name…"
        testId="batches-table"
        empty={
          <EmptyState title="No batches yet.">
            Upload many files at once from a study or a specimen page; each upload becomes a batch here.
          </EmptyState>
        }
      />
    </Panel>
  );
}
