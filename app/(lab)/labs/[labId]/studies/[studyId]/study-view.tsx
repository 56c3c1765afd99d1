"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import type { ColumnDef } from "@tanstack/react-table";
import { useRouter } from "next/navigation";
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
import { specimenCreateSchema, studyCreateSchema, type SpecimenInput, type StudyInput } from "@/lib/contracts/study";
import type { SpecimenDto } from "@/lib/server/studies/specimens";
import type { StudyDto } from "@/lib/server/studies/studies";
import { CONDITIONS_LIST_ID, StudyConditions } from "./study-conditions";
import { BatchUploadPanel } from "../../batches/batch-upload-panel";

export function StudyView({
  labId,
  study,
  canAddSpecimen,
  batchMaxUploadBytes,
}: {
  labId: string;
  study: StudyDto;
  canAddSpecimen: boolean;
  /** Given when the viewer may upload: the batch upload panel is shown with this per-file limit. */
  batchMaxUploadBytes?: number;
}) {
  const router = useRouter();
  const [refresh, setRefresh] = useState(0);
  const [adding, setAdding] = useState(false);
  const [editing, setEditing] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const columns: ColumnDef<SpecimenDto, unknown>[] = [
    {
      id: "label",
      header: "Specimen",
      cell: ({ row }) => (
        <LongName
          className="font-medium text-moss hover:underline"
          href={`/labs/${labId}/specimens/${row.original.id}`}
          text={row.original.label}
        />
      ),
    },
    {
      id: "condition",
      header: "Condition",
      cell: ({ row }) => (
        <Badge tone="moss">
          <LongName size="short" text={row.original.condition} />
        </Badge>
      ),
    },
    { id: "stage", header: "Stage", meta: { hideBelow: "sm" }, cell: ({ row }) => row.original.stage ?? "—" },
    { id: "genotype", header: "Genotype", meta: { hideBelow: "sm" }, cell: ({ row }) => row.original.genotype ?? "—" },
    {
      id: "uploads",
      header: "Files",
      enableSorting: false,
      cell: ({ row }) => <span className="num">{row.original.uploadCount}</span>,
    },
    {
      id: "createdAt",
      header: "Added",
      meta: { hideBelow: "sm" },
      cell: ({ row }) => <span className="num text-ink-soft">{formatDate(row.original.createdAt)}</span>,
    },
  ];
  async function remove() {
    if (!confirm(`Delete the study “${study.name}” and its specimens? This cannot be undone.`)) return;
    setError(null);
    try {
      await sendJson("DELETE", `/api/v1/labs/${labId}/studies/${study.id}`);
      router.push(`/labs/${labId}/studies`);
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not delete the study.");
    }
  }
  return (
    <div className="space-y-5">
      {error && <Notice tone="error">{error}</Notice>}
      {study.description && <p className="max-w-3xl text-sm text-ink-soft">{study.description}</p>}
      <div className="flex flex-wrap gap-2">
        {canAddSpecimen && !adding && (
          <Button onClick={() => setAdding(true)} data-testid="new-specimen">
            Add specimen
          </Button>
        )}
        {study.canEdit && !editing && (
          <Button variant="secondary" onClick={() => setEditing(true)}>
            Edit study
          </Button>
        )}
        {study.canEdit && (
          <Button variant="danger" onClick={remove} data-testid="delete-study">
            Delete study
          </Button>
        )}
      </div>
      {editing && (
        <EditStudyForm
          labId={labId}
          study={study}
          onDone={() => {
            setEditing(false);
            router.refresh();
          }}
        />
      )}
      {adding && (
        <SpecimenForm
          labId={labId}
          studyId={study.id}
          onDone={() => {
            setAdding(false);
            setRefresh((r) => r + 1);
          }}
          onCancel={() => setAdding(false)}
        />
      )}
      <StudyConditions
        labId={labId}
        studyId={study.id}
        canEdit={study.canEdit}
        refreshKey={refresh}
        onRenamed={() => setRefresh((r) => r + 1)}
      />
      {canAddSpecimen && batchMaxUploadBytes !== undefined && (
        <BatchUploadPanel
          labId={labId}
          target={{ kind: "study", studyId: study.id }}
          maxUploadBytes={batchMaxUploadBytes}
          onStored={() => setRefresh((r) => r + 1)}
        />
      )}
      <DataTable<SpecimenDto>
        url={`/api/v1/labs/${labId}/studies/${study.id}/specimens`}
        columns={columns}
        defaultSort={{ id: "label", desc: false }}
        filterPlaceholder="Filter by label, condition, stage, genotype…"
        testId="specimens-table"
        refreshKey={refresh}
        empty={
          <EmptyState title="No specimens in this study yet.">
            {canAddSpecimen
              ? "Add one per sample, with its condition (e.g. control) and stage."
              : "Specimens added by the lab appear here."}
          </EmptyState>
        }
      />
    </div>
  );
}

function EditStudyForm({ labId, study, onDone }: { labId: string; study: StudyDto; onDone: () => void }) {
  const [error, setError] = useState<string | null>(null);
  const form = useForm<StudyInput>({
    resolver: zodResolver(studyCreateSchema),
    defaultValues: {
      name: study.name,
      tissue: study.tissue,
      organism: study.organism,
      description: study.description ?? "",
    },
  });
  const e = form.formState.errors;
  return (
    <Panel title="Edit study">
      <form
        noValidate
        className="grid gap-4 md:grid-cols-3"
        onSubmit={form.handleSubmit(async (v) => {
          try {
            await sendJson("PATCH", `/api/v1/labs/${labId}/studies/${study.id}`, v);
            onDone();
          } catch (err) {
            setError(err instanceof ApiError ? err.message : "Could not save.");
          }
        })}
      >
        {error && (
          <div className="md:col-span-3">
            <Notice tone="error">{error}</Notice>
          </div>
        )}
        <TextField label="Name" {...form.register("name")} error={e.name?.message} />
        <TextField label="Tissue" {...form.register("tissue")} error={e.tissue?.message} />
        <TextField label="Organism" {...form.register("organism")} error={e.organism?.message} />
        <div className="md:col-span-3">
          <TextArea label="Description" {...form.register("description")} error={e.description?.message} />
        </div>
        <div className="md:col-span-3">
          <Button type="submit">Save</Button>
        </div>
      </form>
    </Panel>
  );
}

export function SpecimenForm({
  labId,
  studyId,
  specimen,
  onDone,
  onCancel,
}: {
  labId: string;
  studyId: string;
  specimen?: SpecimenDto;
  onDone: () => void;
  onCancel: () => void;
}) {
  const [error, setError] = useState<string | null>(null);
  const form = useForm<SpecimenInput>({
    resolver: zodResolver(specimenCreateSchema),
    defaultValues: specimen
      ? {
          label: specimen.label,
          condition: specimen.condition,
          stage: specimen.stage ?? "",
          genotype: specimen.genotype ?? "",
          notes: specimen.notes ?? "",
        }
      : undefined,
  });
  const e = form.formState.errors;
  async function onSubmit(values: SpecimenInput) {
    setError(null);
    try {
      if (specimen) await sendJson("PATCH", `/api/v1/labs/${labId}/specimens/${specimen.id}`, values);
      else await sendJson("POST", `/api/v1/labs/${labId}/studies/${studyId}/specimens`, values);
      onDone();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not save the specimen.");
    }
  }
  return (
    <Panel title={specimen ? "Edit specimen" : "Add specimen"}>
      <form
        onSubmit={form.handleSubmit(onSubmit)}
        className="grid gap-4 md:grid-cols-4"
        noValidate
        data-testid="specimen-form"
      >
        {error && (
          <div className="md:col-span-4">
            <Notice tone="error">{error}</Notice>
          </div>
        )}
        <TextField label="Label" placeholder="e.g. E14-03" {...form.register("label")} error={e.label?.message} />
        <TextField
          label="Condition"
          placeholder="control, or treatment and dose"
          list={CONDITIONS_LIST_ID}
          {...form.register("condition")}
          error={e.condition?.message}
        />
        <TextField
          label="Stage (optional)"
          placeholder="e.g. E14.5"
          {...form.register("stage")}
          error={e.stage?.message}
        />
        <TextField
          label="Genotype (optional)"
          placeholder="e.g. wild type"
          {...form.register("genotype")}
          error={e.genotype?.message}
        />
        <div className="md:col-span-4">
          <TextArea label="Notes (optional)" {...form.register("notes")} error={e.notes?.message} />
        </div>
        <div className="flex gap-2 md:col-span-4">
          <Button type="submit" disabled={form.formState.isSubmitting} data-testid="save-specimen">
            {specimen ? "Save" : "Add specimen"}
          </Button>
          <Button variant="ghost" onClick={onCancel}>
            Cancel
          </Button>
        </div>
      </form>
    </Panel>
  );
}
