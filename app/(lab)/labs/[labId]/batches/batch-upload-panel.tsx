"use client";
/**
 * Many files at once (several chosen, or a whole folder) into one specimen or a study: the
 * settings are chosen once, a batch is started, then each file is sent in its own request (at
 * most 3 at a time) with its progress; a file that fails shows why in its row and the others go
 * on. The summary below fills in live as the readouts finish, and stays reachable at the batch's page.
 */
import Link from "next/link";
import { useEffect, useMemo, useRef, useState } from "react";
import useSWR from "swr";
import { Button, buttonClass } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { ApiError, fetchJson, sendJson } from "@/lib/client/api";
import { formatBytes } from "@/lib/client/format";
import { runPool, sendFormWithProgress } from "@/lib/client/send-files";
import type { BatchDto } from "@/lib/server/batches/batches";
import type { BatchSummary } from "@/lib/server/batches/summary";
import { BatchSummaryTable, tableRowOf, type BatchTableRow } from "./batch-summary-table";
import { optionalTypedNumber } from "@/lib/format/typed-number";

/** Files sent at once: enough to keep the line busy, few enough not to crowd the server's upload gate. */
const IN_FLIGHT = 3;

type Target = { kind: "specimen"; specimenId: string } | { kind: "study"; studyId: string };

interface Sent {
  name: string;
  sizeBytes: number;
  phase: "waiting" | "uploading" | "stored" | "failed";
  progress: number;
  message: string | null;
  uploadId: string | null;
}

export function BatchUploadPanel({
  labId,
  target,
  maxUploadBytes,
  onStored,
}: {
  labId: string;
  target: Target;
  maxUploadBytes: number;
  /** Called as files are stored (the page's own lists refresh). */
  onStored?: () => void;
}) {
  const filesRef = useRef<HTMLInputElement>(null);
  const folderRef = useRef<HTMLInputElement>(null);
  const [chosen, setChosen] = useState<File[]>([]);
  const [mode, setMode] = useState<"specimen-per-file" | "one-specimen">("specimen-per-file");
  const [condition, setCondition] = useState("");
  const [stage, setStage] = useState("");
  const [label, setLabel] = useState("");
  const [pixelSize, setPixelSize] = useState("");
  const [override, setOverride] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [batch, setBatch] = useState<BatchDto | null>(null);
  const [sent, setSent] = useState<Sent[]>([]);
  const [sending, setSending] = useState(false);

  // React has no prop for folder picking; the attribute is what browsers read.
  useEffect(() => {
    folderRef.current?.setAttribute("webkitdirectory", "");
  }, []);

  const pick = (list: FileList | null) =>
    setChosen([...(list ?? [])].filter((f) => !f.name.startsWith(".")).sort((a, b) => a.name.localeCompare(b.name)));

  const update = (i: number, patch: Partial<Sent>) =>
    setSent((all) => all.map((s, j) => (j === i ? { ...s, ...patch } : s)));

  const { data: summary, mutate } = useSWR<BatchSummary>(
    batch ? `/api/v1/labs/${labId}/batches/${batch.id}` : null,
    fetchJson,
    {
      refreshInterval: (s) => (sending || !s || !s.done ? 1500 : 0),
    },
  );

  async function start(e: React.FormEvent) {
    e.preventDefault();
    if (chosen.length === 0) return setError("Choose files or a folder first.");
    setError(null);
    const body =
      target.kind === "specimen"
        ? { target: "specimen", specimenId: target.specimenId }
        : {
            target: mode,
            studyId: target.studyId,
            condition,
            stage,
            ...(mode === "one-specimen" ? { specimenLabel: label } : {}),
          };
    let b: BatchDto;
    try {
      b = await sendJson<BatchDto>("POST", `/api/v1/labs/${labId}/batches`, {
        ...body,
        pixelSizeUm: optionalTypedNumber(pixelSize) ?? null,
        pixelSizeOverride: override,
      });
    } catch (err) {
      return setError(err instanceof ApiError ? err.message : "The batch could not be started.");
    }
    const files = chosen;
    setBatch(b);
    setSent(
      files.map((f) => ({
        name: f.name,
        sizeBytes: f.size,
        phase: "waiting",
        progress: 0,
        message: null,
        uploadId: null,
      })),
    );
    setSending(true);
    await runPool(files, IN_FLIGHT, async (file, i) => {
      if (file.size === 0) return update(i, { phase: "failed", message: "the file is empty (0 bytes)" });
      if (file.size > maxUploadBytes)
        return update(i, {
          phase: "failed",
          message: `the file is ${formatBytes(file.size)}, above the limit of ${formatBytes(maxUploadBytes)}`,
        });
      update(i, { phase: "uploading" });
      const form = new FormData();
      form.set("file", file, file.name);
      try {
        const u = await sendFormWithProgress<{ id: string }>(
          `/api/v1/labs/${labId}/batches/${b.id}/uploads`,
          form,
          (p) => update(i, { progress: p.sent }),
        );
        update(i, { phase: "stored", progress: 1, uploadId: u.id });
        onStored?.();
      } catch (err) {
        update(i, { phase: "failed", message: err instanceof ApiError ? err.message : "the upload failed" });
      }
    });
    setSending(false);
    await mutate();
    if (filesRef.current) filesRef.current.value = "";
    if (folderRef.current) folderRef.current.value = "";
    setChosen([]);
  }

  const rows = useMemo<BatchTableRow[]>(() => {
    const byUpload = new Map((summary?.rows ?? []).filter((r) => r.uploadId).map((r) => [r.uploadId!, r]));
    return sent.map((s, i) => {
      const known = s.uploadId ? byUpload.get(s.uploadId) : undefined;
      if (known) return tableRowOf(known, `${i}`);
      const failed = s.phase === "failed";
      return {
        key: `${i}`,
        filename: s.name,
        specimenLabel: null,
        specimenId: null,
        readoutId: null,
        wavelengthUm: null,
        uncertaintyUm: null,
        symmetry: null,
        significance: null,
        status: s.phase,
        statusText: failed ? `failed: ${s.message}` : s.phase === "uploading" ? "uploading" : s.phase,
        progress: s.phase === "uploading" ? s.progress : null,
      };
    });
  }, [sent, summary]);
  const finished = batch && !sending && summary?.done;

  return (
    <Panel
      title="Upload many files"
      actions={batch ? <span className="text-xs text-ink-soft">{batch.name}</span> : null}
    >
      <form onSubmit={start} className="space-y-4" data-testid="batch-form">
        <div className="flex flex-wrap items-end gap-4">
          <label className="block space-y-1">
            <span className="text-sm font-medium">Files</span>
            <input
              ref={filesRef}
              type="file"
              multiple
              data-testid="batch-files"
              accept=".png,.jpg,.jpeg,.tif,.tiff,.csv,.tsv,.txt"
              className="block text-sm"
              onChange={(e) => pick(e.target.files)}
            />
          </label>
          <label className="block space-y-1">
            <span className="text-sm font-medium">or a whole folder</span>
            <input
              ref={folderRef}
              type="file"
              multiple
              data-testid="batch-folder"
              className="block text-sm"
              onChange={(e) => pick(e.target.files)}
            />
          </label>
          <div className="w-48">
            <TextField
              label="Batch pixel size (µm/px)"
              name="batchPixelSizeUm"
              inputMode="decimal"
              placeholder="from each file if present"
              value={pixelSize}
              onChange={(e) => setPixelSize(e.target.value)}
            />
          </div>
          <label className="flex items-center gap-2 pb-2 text-sm">
            <input type="checkbox" checked={override} onChange={(e) => setOverride(e.target.checked)} />
            use it for every file, even those with their own pixel size
          </label>
        </div>
        {target.kind === "study" && (
          <div className="flex flex-wrap items-end gap-4">
            <fieldset className="space-y-1 text-sm">
              <legend className="font-medium">The files are</legend>
              <label className="flex items-center gap-2">
                <input
                  type="radio"
                  name="batchMode"
                  data-testid="batch-mode-per-file"
                  checked={mode === "specimen-per-file"}
                  onChange={() => setMode("specimen-per-file")}
                />
                each file is a different specimen (named from the file name)
              </label>
              <label className="flex items-center gap-2">
                <input
                  type="radio"
                  name="batchMode"
                  data-testid="batch-mode-one"
                  checked={mode === "one-specimen"}
                  onChange={() => setMode("one-specimen")}
                />
                all files are one specimen
              </label>
            </fieldset>
            {mode === "one-specimen" && (
              <div className="w-48">
                <TextField
                  label="Specimen label"
                  name="batchLabel"
                  value={label}
                  onChange={(e) => setLabel(e.target.value)}
                />
              </div>
            )}
            <div className="w-56">
              <TextField
                label="Batch condition"
                name="batchCondition"
                placeholder="e.g. control"
                value={condition}
                onChange={(e) => setCondition(e.target.value)}
              />
            </div>
            <div className="w-40">
              <TextField
                label="Batch stage"
                name="batchStage"
                value={stage}
                onChange={(e) => setStage(e.target.value)}
              />
            </div>
          </div>
        )}
        <div className="flex items-center gap-3">
          <Button type="submit" disabled={sending} data-testid="batch-submit">
            {sending ? "Uploading…" : chosen.length ? `Upload ${chosen.length} file(s)` : "Upload"}
          </Button>
          <span className="text-xs text-ink-soft">
            PNG, JPEG, TIFF, CSV, TSV or XLSX, each up to {formatBytes(maxUploadBytes)}; each is read with these
            settings.
          </span>
        </div>
      </form>
      {error && (
        <div className="mt-3">
          <Notice tone="error" testId="batch-error">
            {error}
          </Notice>
        </div>
      )}
      {batch && (
        <div className="mt-4 space-y-3">
          <BatchSummaryTable labId={labId} rows={rows} />
          <div className="flex flex-wrap items-center gap-3 text-sm" data-testid="batch-summary">
            <span>
              {finished
                ? `All read: ${summary!.counts.read} with a period, ${summary!.counts["no-period"]} without a significant period, ${rows.filter((r) => r.status === "failed").length} failed.`
                : "Reading… the table fills in as each file's readout finishes."}
            </span>
            <Link className={buttonClass("secondary", "sm")} href={`/labs/${labId}/batches/${batch.id}`}>
              Open the batch
            </Link>
            <a
              className={buttonClass("secondary", "sm")}
              href={`/api/v1/labs/${labId}/batches/${batch.id}/csv`}
              data-testid="batch-csv"
            >
              Download CSV
            </a>
          </div>
        </div>
      )}
    </Panel>
  );
}
