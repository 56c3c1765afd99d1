"use client";
import { formatPixelSize } from "@/lib/format/measurement";
import type { ColumnDef } from "@tanstack/react-table";
import { useRouter } from "next/navigation";
import { useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { LongName } from "@/components/ui/long-name";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Badge, EmptyState, Panel } from "@/components/ui/panel";
import { ApiError, sendForm, sendJson } from "@/lib/client/api";
import { formatBytes, formatDateTime } from "@/lib/client/format";
import type { SpecimenDto } from "@/lib/server/studies/specimens";
import type { UploadDto } from "@/lib/server/uploads/uploads";
import { SpecimenForm } from "../../studies/[studyId]/study-view";
import { BatchUploadPanel } from "../../batches/batch-upload-panel";
import { ReadoutsPanel } from "./readouts-panel";

const TABLE_KINDS: Record<string, string> = {
  "text/csv": "csv",
  "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet": "xlsx",
};

export function SpecimenView({
  labId,
  specimen,
  canUpload,
  maxUploadBytes,
}: {
  labId: string;
  specimen: SpecimenDto;
  canUpload: boolean;
  maxUploadBytes: number;
}) {
  const router = useRouter();
  const [refresh, setRefresh] = useState(0);
  const [editing, setEditing] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function removeUpload(u: UploadDto) {
    if (!confirm(`Delete “${u.filename}”? The stored original goes too.`)) return;
    setError(null);
    try {
      await sendJson("DELETE", `/api/v1/labs/${labId}/uploads/${u.id}`);
      setRefresh((r) => r + 1);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not delete the file.");
    }
  }
  async function removeSpecimen() {
    if (!confirm(`Delete specimen “${specimen.label}”?`)) return;
    try {
      await sendJson("DELETE", `/api/v1/labs/${labId}/specimens/${specimen.id}`);
      router.push(`/labs/${labId}/studies/${specimen.studyId}`);
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not delete the specimen.");
    }
  }

  const columns: ColumnDef<UploadDto, unknown>[] = [
    {
      id: "filename",
      header: "File",
      cell: ({ row }) => (
        <>
          <LongName
            className="font-medium text-moss hover:underline"
            href={`/api/v1/labs/${labId}/uploads/${row.original.id}/content`}
            download
            testId="download-link"
            text={row.original.filename}
          />
          {row.original.duplicateOf && (
            <span className="block text-xs text-ochre" data-testid="duplicate-file">
              same file as “{row.original.duplicateOf.filename}” — counted once
            </span>
          )}
        </>
      ),
    },
    {
      id: "kind",
      header: "Kind",
      meta: { hideBelow: "sm" },
      cell: ({ row }) => (
        <Badge tone={row.original.kind === "image" ? "moss" : "plain"}>
          {row.original.kind === "image"
            ? `image · ${row.original.contentType.split("/")[1]}`
            : `table · ${TABLE_KINDS[row.original.contentType] ?? "tsv"}`}
        </Badge>
      ),
    },
    {
      id: "sizeBytes",
      header: "Size",
      meta: { hideBelow: "sm" },
      cell: ({ row }) => <span className="num">{formatBytes(row.original.sizeBytes)}</span>,
    },
    {
      id: "pixelSize",
      header: "Pixel size",
      enableSorting: false,
      meta: { hideBelow: "sm" },
      cell: ({ row }) =>
        row.original.pixelSizeUm ? (
          <span className="num">{formatPixelSize(row.original.pixelSizeUm)} µm/px</span>
        ) : (
          <span className="text-ink-soft">—</span>
        ),
    },
    {
      id: "sha256",
      header: "SHA-256",
      enableSorting: false,
      meta: { hideBelow: "sm" },
      cell: ({ row }) => (
        <span className="num text-xs text-ink-soft" title={row.original.sha256}>
          {row.original.sha256.slice(0, 12)}…
        </span>
      ),
    },
    {
      id: "createdAt",
      header: "Uploaded",
      meta: { hideBelow: "sm" },
      cell: ({ row }) => (
        <span className="text-ink-soft">
          <span className="num">{formatDateTime(row.original.createdAt)}</span>
          <br />
          {row.original.uploadedByEmail}
        </span>
      ),
    },
    {
      id: "actions",
      header: "",
      enableSorting: false,
      cell: ({ row }) =>
        row.original.canDelete ? (
          <Button size="sm" variant="danger" onClick={() => removeUpload(row.original)} data-testid="delete-upload">
            Delete
          </Button>
        ) : null,
    },
  ];
  return (
    <div className="space-y-5">
      {error && (
        <Notice tone="error" testId="specimen-error">
          {error}
        </Notice>
      )}
      {specimen.notes && <p className="max-w-3xl whitespace-pre-line text-sm text-ink-soft">{specimen.notes}</p>}
      {specimen.canEdit && (
        <div className="flex gap-2">
          {!editing && (
            <Button variant="secondary" onClick={() => setEditing(true)}>
              Edit specimen
            </Button>
          )}
          <Button variant="danger" onClick={removeSpecimen}>
            Delete specimen
          </Button>
        </div>
      )}
      {editing && (
        <SpecimenForm
          labId={labId}
          studyId={specimen.studyId}
          specimen={specimen}
          onDone={() => {
            setEditing(false);
            router.refresh();
          }}
          onCancel={() => setEditing(false)}
        />
      )}
      {canUpload && (
        <UploadForm
          labId={labId}
          specimenId={specimen.id}
          maxUploadBytes={maxUploadBytes}
          onDone={() => setRefresh((r) => r + 1)}
        />
      )}
      {canUpload && (
        <BatchUploadPanel
          labId={labId}
          target={{ kind: "specimen", specimenId: specimen.id }}
          maxUploadBytes={maxUploadBytes}
          onStored={() => setRefresh((r) => r + 1)}
        />
      )}
      <Panel title="Files">
        <DataTable<UploadDto>
          url={`/api/v1/labs/${labId}/specimens/${specimen.id}/uploads`}
          columns={columns}
          defaultSort={{ id: "createdAt", desc: true }}
          filterPlaceholder="Filter by file name…"
          testId="uploads-table"
          refreshKey={refresh}
          empty={
            <EmptyState title="No files yet.">
              {canUpload
                ? "Upload a stained image or a spacing table above."
                : "Files uploaded by the lab appear here."}
            </EmptyState>
          }
        />
      </Panel>
      <ReadoutsPanel labId={labId} specimenId={specimen.id} refreshKey={refresh} />
    </div>
  );
}

function UploadForm({
  labId,
  specimenId,
  maxUploadBytes,
  onDone,
}: {
  labId: string;
  specimenId: string;
  maxUploadBytes: number;
  onDone: () => void;
}) {
  const fileRef = useRef<HTMLInputElement>(null);
  const [pixelSize, setPixelSize] = useState("");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const file = fileRef.current?.files?.[0];
    if (!file) return setMessage({ tone: "error", text: "Choose a file first." });
    if (file.size === 0) return setMessage({ tone: "error", text: "The file is empty (0 bytes)." });
    if (file.size > maxUploadBytes)
      return setMessage({ tone: "error", text: `The file is too large: the limit is ${formatBytes(maxUploadBytes)}.` });
    const form = new FormData();
    form.set("file", file);
    if (pixelSize.trim()) form.set("pixelSizeUm", pixelSize.trim());
    setBusy(true);
    setMessage(null);
    try {
      const u = await sendForm<UploadDto>(`/api/v1/labs/${labId}/specimens/${specimenId}/uploads`, form);
      setMessage({
        tone: "success",
        text: `Stored “${u.filename}” (${formatBytes(u.sizeBytes)}, SHA-256 ${u.sha256.slice(0, 12)}…).`,
      });
      if (fileRef.current) fileRef.current.value = "";
      onDone();
    } catch (err) {
      setMessage({ tone: "error", text: err instanceof ApiError ? err.message : "The upload failed." });
    } finally {
      setBusy(false);
    }
  }
  return (
    <Panel title="Upload a file">
      <form onSubmit={submit} className="flex flex-wrap items-end gap-4" data-testid="upload-form">
        <label className="block space-y-1">
          <span className="text-sm font-medium">Image or table</span>
          <input
            ref={fileRef}
            type="file"
            name="file"
            data-testid="upload-file"
            accept=".png,.jpg,.jpeg,.tif,.tiff,.csv,.tsv,.txt,.xlsx"
            className="block text-sm"
          />
          <span className="block text-xs text-ink-soft">
            PNG, JPEG, TIFF (8/16-bit, 32-bit float, stacks), CSV, TSV or XLSX; up to {formatBytes(maxUploadBytes)}. The
            type is judged by content.
          </span>
        </label>
        <div className="w-48">
          <TextField
            label="Pixel size (µm/px)"
            name="pixelSizeUm"
            inputMode="decimal"
            placeholder="from file if present"
            value={pixelSize}
            onChange={(e) => setPixelSize(e.target.value)}
          />
        </div>
        <Button type="submit" disabled={busy} data-testid="upload-submit">
          {busy ? "Uploading…" : "Upload"}
        </Button>
      </form>
      {message && (
        <div className="mt-3">
          <Notice tone={message.tone} testId="upload-message">
            {message.text}
          </Notice>
        </div>
      )}
    </Panel>
  );
}
