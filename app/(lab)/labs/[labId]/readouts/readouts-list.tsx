"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/ui/data-table";
import { LongName } from "@/components/ui/long-name";
import { useLiveJobs } from "@/lib/client/use-live-jobs";
import { Badge, EmptyState } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import type { ReadoutDto } from "@/lib/server/readouts/readouts";
import { formatSig, plusMinus, settingsSummary, STATUS_TONE, STATUS_WORDS } from "./readout-format";

/** The jobs whose status this list shows: it updates while they run and when they end. */
const READOUT_JOBS = ["readout"] as const;

export function ReadoutsList({ labId }: { labId: string }) {
  const live = useLiveJobs(labId, READOUT_JOBS);
  const columns: ColumnDef<ReadoutDto, unknown>[] = [
    {
      id: "filename",
      header: "File",
      enableSorting: false,
      cell: ({ row }) => (
        <LongName
          className="font-medium text-moss hover:underline"
          href={`/labs/${labId}/readouts/${row.original.id}`}
          text={row.original.filename}
        />
      ),
    },
    {
      id: "status",
      header: "Status",
      cell: ({ row }) => (
        <Badge tone={STATUS_TONE[row.original.status]}>
          {STATUS_WORDS[row.original.status]}
          {row.original.status === "running" ? ` ${Math.round(row.original.progress * 100)} %` : ""}
        </Badge>
      ),
    },
    {
      id: "wavelengthUm",
      header: "Wavelength",
      cell: ({ row }) => {
        const h = row.original.headline;
        if (!h) return <span className="text-ink-soft">{row.original.error ?? "—"}</span>;
        if (!h.periodFound)
          return (
            <span className="text-ochre">
              no significant period <span className="num">({formatSig(h.significance, 3)}×)</span>
            </span>
          );
        return <span className="num text-moss">{plusMinus(h.wavelengthUm, h.uncertaintyUm, "µm")}</span>;
      },
    },
    {
      id: "settings",
      header: "Settings",
      enableSorting: false,
      cell: ({ row }) => <span className="text-xs text-ink-soft">{settingsSummary(row.original)}</span>,
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
    <DataTable<ReadoutDto>
      refreshKey={live.version}
      url={`/api/v1/labs/${labId}/readouts`}
      columns={columns}
      defaultSort={{ id: "createdAt", desc: true }}
      filterPlaceholder="Filter by file name…"
      testId="lab-readouts-table"
      empty={
        <EmptyState title="No readouts yet.">
          Upload an image or a spacing table to a specimen (Studies → a study → a specimen); its readout starts by
          itself.
        </EmptyState>
      }
    />
  );
}
