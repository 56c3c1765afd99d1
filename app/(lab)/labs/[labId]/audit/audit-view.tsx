"use client";
import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/ui/data-table";
import { Badge, EmptyState } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import type { AuditEventDto } from "@/lib/server/audit";

export function AuditView({ labId }: { labId: string }) {
  const columns: ColumnDef<AuditEventDto, unknown>[] = [
    {
      id: "at",
      header: "When",
      cell: ({ row }) => <span className="num whitespace-nowrap text-ink-soft">{formatDateTime(row.original.at)}</span>,
    },
    {
      id: "actorEmail",
      header: "Who",
      cell: ({ row }) => <span className="num">{row.original.actorEmail ?? "—"}</span>,
    },
    {
      id: "action",
      header: "What",
      cell: ({ row }) => (
        <Badge
          tone={row.original.action.endsWith("deleted") || row.original.action.endsWith("removed") ? "brick" : "plain"}
        >
          {row.original.action}
        </Badge>
      ),
    },
    { id: "summary", header: "Details", enableSorting: false, cell: ({ row }) => row.original.summary },
  ];
  return (
    <DataTable<AuditEventDto>
      url={`/api/v1/labs/${labId}/audit`}
      columns={columns}
      defaultSort={{ id: "at", desc: true }}
      pageSize={50}
      filterPlaceholder="Filter by person, action, text…"
      testId="audit-table"
      empty={<EmptyState title="Nothing recorded yet." />}
    />
  );
}
