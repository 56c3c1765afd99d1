/**
 * A batch's summary: one row per file — each stored upload with the readout the batch started
 * (its first), and each file refused at upload that was not stored later — with λ ± u in µm,
 * symmetry, significance and a status in words. Read live while the readouts run.
 */
import "server-only";
import type { LabContext } from "../access";
import { database } from "../services";
import { toReadoutDtos, type ReadoutDto } from "../readouts/readouts";
import { findBatch, toBatchDtos, type BatchDto } from "./batches";

/** `read`: a period was found; `no-period`: read, no significant period; `failed`: refused or the readout failed. */
export type BatchRowStatus = "queued" | "reading" | "read" | "no-period" | "failed" | "cancelled";

export interface BatchSummaryRow {
  filename: string;
  uploadId: string | null;
  specimenId: string | null;
  specimenLabel: string | null;
  readoutId: string | null;
  status: BatchRowStatus;
  /** The status as a person reads it, with the reason of a failure. */
  statusText: string;
  measure: string | null;
  wavelengthUm: number | null;
  uncertaintyUm: number | null;
  symmetry: string | null;
  significance: number | null;
  pixelSizeUm: number | null;
  pixelSizeSource: string | null;
  progress: number;
  /** Why it failed, or what a finished readout says besides (no significant period). */
  message: string | null;
}

export interface BatchSummary extends BatchDto {
  rows: BatchSummaryRow[];
  /** Every file read, refused or failed: nothing is still queued or running. */
  done: boolean;
  counts: Record<BatchRowStatus, number>;
}

function rowOfReadout(
  r: ReadoutDto | undefined,
): Pick<
  BatchSummaryRow,
  | "readoutId"
  | "status"
  | "statusText"
  | "measure"
  | "wavelengthUm"
  | "uncertaintyUm"
  | "symmetry"
  | "significance"
  | "progress"
  | "message"
> {
  const empty = { measure: null, wavelengthUm: null, uncertaintyUm: null, symmetry: null, significance: null };
  if (!r) {
    const message = "no readout was started (the pixel size is missing or the settings could not be used)";
    return { readoutId: null, status: "failed", statusText: `failed: ${message}`, progress: 0, message, ...empty };
  }
  const base = { readoutId: r.id, progress: r.progress };
  if (r.status === "queued") return { ...base, status: "queued", statusText: "queued", message: null, ...empty };
  if (r.status === "running")
    return {
      ...base,
      status: "reading",
      statusText: `reading${r.progressNote ? `: ${r.progressNote}` : ""}`,
      message: null,
      ...empty,
    };
  if (r.status === "cancelled")
    return { ...base, status: "cancelled", statusText: "cancelled", message: r.error, ...empty };
  if (r.status !== "succeeded" || !r.headline) {
    const message = r.error ?? "the readout failed";
    return { ...base, status: "failed", statusText: `failed: ${message}`, message, ...empty };
  }
  const h = r.headline;
  const numbers = {
    measure: h.measure,
    symmetry: h.symmetry ?? null,
    significance: h.significance ?? null,
  };
  if (!h.periodFound)
    return {
      ...base,
      ...numbers,
      status: "no-period",
      statusText: "no significant period",
      wavelengthUm: null,
      uncertaintyUm: null,
      message: "no significant period",
    };
  return {
    ...base,
    ...numbers,
    status: "read",
    statusText: "read",
    wavelengthUm: h.wavelengthUm,
    uncertaintyUm: h.uncertaintyUm,
    message: null,
  };
}

export async function getBatchSummary(ctx: LabContext, batchId: string): Promise<BatchSummary> {
  const m = await database();
  const batch = await findBatch(ctx, batchId);
  const [dto] = await toBatchDtos([batch]);
  const uploads = await m.Upload.findAll({
    where: { labId: ctx.labId, batchId: batch.id },
    order: [
      ["createdAt", "asc"],
      ["id", "asc"],
    ],
  });
  const [readoutRows, specimens, rejections] = await Promise.all([
    uploads.length
      ? m.Readout.findAll({
          where: { uploadId: uploads.map((u) => u.id) },
          order: [
            ["createdAt", "asc"],
            ["id", "asc"],
          ],
        })
      : [],
    uploads.length ? m.Specimen.findAll({ where: { id: [...new Set(uploads.map((u) => u.specimenId))] } }) : [],
    m.BatchRejection.findAll({ where: { batchId: batch.id }, order: [["createdAt", "asc"]] }),
  ]);
  // The batch's readout of an upload is its first; later ones are re-runs with other settings.
  const first = new Map<string, (typeof readoutRows)[number]>();
  for (const r of readoutRows) if (!first.has(r.uploadId)) first.set(r.uploadId, r);
  const dtos = new Map((await toReadoutDtos([...first.values()])).map((d) => [d.uploadId, d]));
  const labels = new Map(specimens.map((s) => [s.id, s.label]));
  const rows: BatchSummaryRow[] = uploads.map((u) => ({
    filename: u.filename,
    uploadId: u.id,
    specimenId: u.specimenId,
    specimenLabel: labels.get(u.specimenId) ?? null,
    pixelSizeUm: u.pixelSizeUm,
    pixelSizeSource: u.pixelSizeSource,
    ...rowOfReadout(dtos.get(u.id)),
  }));
  // A refused file sent again and stored later is listed once, as stored.
  const stored = new Set(uploads.map((u) => u.filename));
  const refused = new Map<string, (typeof rejections)[number]>();
  for (const r of rejections) if (!stored.has(r.filename)) refused.set(r.filename, r);
  for (const r of refused.values())
    rows.push({
      filename: r.filename,
      uploadId: null,
      specimenId: null,
      specimenLabel: null,
      readoutId: null,
      status: "failed",
      statusText: `failed: ${r.message}`,
      measure: null,
      wavelengthUm: null,
      uncertaintyUm: null,
      symmetry: null,
      significance: null,
      pixelSizeUm: null,
      pixelSizeSource: null,
      progress: 0,
      message: r.message,
    });
  const counts: Record<BatchRowStatus, number> = {
    queued: 0,
    reading: 0,
    read: 0,
    "no-period": 0,
    failed: 0,
    cancelled: 0,
  };
  for (const r of rows) counts[r.status]++;
  return { ...dto, rows, counts, done: counts.queued + counts.reading === 0 };
}
