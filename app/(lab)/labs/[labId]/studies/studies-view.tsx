"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import type { ColumnDef } from "@tanstack/react-table";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { LongName } from "@/components/ui/long-name";
import { TextArea, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Badge, EmptyState, Panel } from "@/components/ui/panel";
import { ApiError, sendJson } from "@/lib/client/api";
import { formatDate } from "@/lib/client/format";
import { studyCreateSchema, type StudyInput } from "@/lib/contracts/study";
import type { StudyDto } from "@/lib/server/studies/studies";

export function StudiesView({ labId, canCreate }: { labId: string; canCreate: boolean }) {
  const [refresh, setRefresh] = useState(0);
  const [open, setOpen] = useState(false);
  const columns: ColumnDef<StudyDto, unknown>[] = [
    {
      id: "name",
      header: "Study",
      cell: ({ row }) => (
        <LongName
          className="font-medium text-moss hover:underline"
          href={`/labs/${labId}/studies/${row.original.id}`}
          text={row.original.name}
        />
      ),
    },
    {
      id: "tissue",
      header: "Tissue",
      meta: { hideBelow: "sm" },
      cell: ({ row }) => <LongName size="short" text={row.original.tissue} />,
    },
    {
      id: "organism",
      header: "Organism",
      meta: { hideBelow: "sm" },
      cell: ({ row }) => <LongName size="short" text={row.original.organism} />,
    },
    {
      id: "specimens",
      header: "Specimens",
      enableSorting: false,
      cell: ({ row }) => <span className="num">{row.original.specimenCount}</span>,
    },
    {
      id: "conditions",
      header: "Conditions",
      enableSorting: false,
      meta: { hideBelow: "sm" },
      cell: ({ row }) => (
        <span className="flex flex-wrap gap-1">
          {row.original.conditions.map((c) => (
            <Badge key={c}>
              <LongName size="short" text={c} />
            </Badge>
          ))}
        </span>
      ),
    },
    {
      id: "createdBy",
      header: "Created by",
      enableSorting: false,
      meta: { hideBelow: "sm" },
      cell: ({ row }) =>
        row.original.createdByEmail ? (
          <LongName size="short" className="text-ink-soft" text={row.original.createdByEmail} />
        ) : (
          <span className="text-ink-soft">—</span>
        ),
    },
    {
      id: "updatedAt",
      header: "Updated",
      meta: { hideBelow: "sm" },
      cell: ({ row }) => <span className="num text-ink-soft">{formatDate(row.original.updatedAt)}</span>,
    },
  ];
  return (
    <div className="space-y-5">
      {canCreate && (
        <div>
          {open ? (
            <NewStudyForm
              labId={labId}
              onDone={() => {
                setOpen(false);
                setRefresh((r) => r + 1);
              }}
              onCancel={() => setOpen(false)}
            />
          ) : (
            <Button onClick={() => setOpen(true)} data-testid="new-study">
              New study
            </Button>
          )}
        </div>
      )}
      <DataTable<StudyDto>
        url={`/api/v1/labs/${labId}/studies`}
        columns={columns}
        defaultSort={{ id: "updatedAt", desc: true }}
        filterPlaceholder="Filter by name, tissue, organism…"
        testId="studies-table"
        refreshKey={refresh}
        empty={
          <EmptyState title="No studies yet.">
            {canCreate
              ? "Create one with “New study”: name it after the tissue and question."
              : "Studies created by your lab appear here."}
          </EmptyState>
        }
      />
    </div>
  );
}

function NewStudyForm({ labId, onDone, onCancel }: { labId: string; onDone: () => void; onCancel: () => void }) {
  const [error, setError] = useState<string | null>(null);
  const form = useForm<StudyInput>({ resolver: zodResolver(studyCreateSchema) });
  const e = form.formState.errors;
  async function onSubmit(values: StudyInput) {
    setError(null);
    try {
      await sendJson("POST", `/api/v1/labs/${labId}/studies`, values);
      onDone();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not create the study.");
    }
  }
  return (
    <Panel title="New study">
      <form
        onSubmit={form.handleSubmit(onSubmit)}
        className="grid gap-4 md:grid-cols-3"
        noValidate
        data-testid="study-form"
      >
        {error && (
          <div className="md:col-span-3">
            <Notice tone="error">{error}</Notice>
          </div>
        )}
        <TextField
          label="Name"
          placeholder="e.g. Dorsal placode spacing, E14"
          {...form.register("name")}
          error={e.name?.message}
        />
        <TextField
          label="Tissue"
          placeholder="e.g. dorsal skin"
          {...form.register("tissue")}
          error={e.tissue?.message}
        />
        <TextField
          label="Organism"
          placeholder="e.g. chick"
          {...form.register("organism")}
          error={e.organism?.message}
        />
        <div className="md:col-span-3">
          <TextArea label="Description (optional)" {...form.register("description")} error={e.description?.message} />
        </div>
        <div className="flex gap-2 md:col-span-3">
          <Button type="submit" disabled={form.formState.isSubmitting} data-testid="save-study">
            Create study
          </Button>
          <Button variant="ghost" onClick={onCancel}>
            Cancel
          </Button>
        </div>
      </form>
    </Panel>
  );
}
