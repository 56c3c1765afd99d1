"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/ui/data-table";
import { LongName } from "@/components/ui/long-name";
import { Badge, EmptyState } from "@/components/ui/panel";
import { formatDate } from "@/lib/client/format";
import type { LabKineticsDto } from "@/lib/server/kinetics/kinetics";

export function LabKineticsList({ labId, canCreate }: { labId: string; canCreate: boolean }) {
  const columns: ColumnDef<LabKineticsDto, unknown>[] = [
    {
      id: "name",
      header: "Kinetics",
      cell: ({ row }) => (
        <LongName
          className="font-medium text-moss hover:underline"
          href={`/labs/${labId}/kinetics/${row.original.id}`}
          text={row.original.name}
        />
      ),
    },
    {
      id: "species",
      header: "Species",
      enableSorting: false,
      meta: { hideBelow: "sm" },
      cell: ({ row }) => (
        <span className="flex flex-wrap gap-1">
          {row.original.species.map((s) => (
            <Badge key={s}>{s}</Badge>
          ))}
        </span>
      ),
    },
    {
      id: "latestVersion",
      header: "Version",
      cell: ({ row }) => <span className="num">v{row.original.latestVersion}</span>,
    },
    {
      id: "createdBy",
      header: "Author",
      enableSorting: false,
      meta: { hideBelow: "sm" },
      cell: ({ row }) => <span className="text-ink-soft">{row.original.createdByEmail ?? "—"}</span>,
    },
    {
      id: "updatedAt",
      header: "Saved",
      meta: { hideBelow: "sm" },
      cell: ({ row }) => <span className="num text-ink-soft">{formatDate(row.original.updatedAt)}</span>,
    },
  ];
  return (
    <DataTable<LabKineticsDto>
      url={`/api/v1/labs/${labId}/kinetics`}
      columns={columns}
      defaultSort={{ id: "updatedAt", desc: true }}
      filterPlaceholder="Filter by name…"
      testId="lab-kinetics-table"
      empty={
        <EmptyState title="The lab has no kinetics of its own yet.">
          {canCreate
            ? "Write one with “New kinetics”: 2–6 species as expressions, named parameters with ranges, and diffusivities."
            : "Kinetics written by the lab's modellers appear here; the published catalogue below can be analysed now."}
        </EmptyState>
      }
    />
  );
}
