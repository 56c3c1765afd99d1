/**
 * One file of a batch: the same path as a single upload (gate, stream, judge by content, store
 * object + row + readout together), with the batch's target and pixel size. A "specimen-per-file"
 * batch creates the file's specimen first (an upload row needs its specimen) and removes it
 * again when the file is refused, so a refused file leaves no specimen, no upload and no object,
 * only a rejection row with its name and the reason for the batch's summary.
 */
import "server-only";
import { openImageFile } from "@/lib/workers/image-file";
import { readPixelSize, sniffFileKind } from "@/lib/imaging";
import { authorize, type LabContext } from "../access";
import { AppError, forbidden, notFound } from "../errors";
import { recordAudit } from "../audit";
import { database, services } from "../services";
import { uploadGate } from "../uploads/back-pressure";
import { parseUpload, uploadTempRoot, type ParsedUpload } from "../uploads/multipart";
import { storeParsed, type ReceivedUpload } from "../uploads/receive";
import { findSpecimen } from "../studies/specimens";
import { findStudy } from "../studies/studies";
import { findBatch } from "./batches";

type BatchRow = Awaited<ReturnType<typeof findBatch>>;

/** Codes that say the file itself was refused (a 503 means "try again", not "this file is bad"). */
const REFUSED = new Set(["bad_input", "too_large", "unprocessable", "conflict", "unsupported_media_type"]);

/** A specimen label from a file name: without folders and extension, at most 120 characters. */
export function labelFromFilename(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? name;
  const stem = base.replace(/\.[A-Za-z0-9]{1,5}$/, "").trim();
  return (stem || base || "specimen").slice(0, 120);
}

/**
 * The batch's pixel size goes in as if typed with the file when it overrides the files' own, or
 * when the file carries none (a request's own `pixelSizeUm` field always wins).
 */
async function applyBatchPixelSize(batch: BatchRow, parsed: ParsedUpload): Promise<void> {
  if (batch.pixelSizeUm === null) return;
  if (parsed.fields.pixelSizeUm !== undefined && parsed.fields.pixelSizeUm.trim() !== "") return;
  const kind = sniffFileKind(parsed.head);
  const image = kind === "png" || kind === "jpeg" || kind === "tiff";
  if (!batch.pixelSizeOverride && image) {
    const file = openImageFile(parsed.file.path); // headers only, read by ranges
    let own: ReturnType<typeof readPixelSize>;
    try {
      own = readPixelSize(file, kind);
    } finally {
      file.close();
    }
    if (own.pixelSizeUm !== null) return;
  }
  parsed.fields.pixelSizeUm = String(batch.pixelSizeUm);
}

export type BatchFileAnswer = ReceivedUpload & { batchId: string; specimenLabel: string };

export async function receiveBatchFile(ctx: LabContext, batchId: string, request: Request): Promise<BatchFileAnswer> {
  authorize(ctx, "upload.create");
  const batch = await findBatch(ctx, batchId);
  if (batch.createdBy !== ctx.actor.userId)
    throw forbidden("only the person who started this batch may add files to it; start your own batch");
  const perFile = batch.target === "specimen-per-file";
  if (perFile) {
    authorize(ctx, "specimen.create");
    if (!batch.studyId) throw notFound("the batch's study");
    await findStudy(ctx, batch.studyId);
  } else {
    if (!batch.specimenId) throw notFound("the batch's specimen");
    await findSpecimen(ctx, batch.specimenId);
  }
  const { config } = services();
  const leave = await uploadGate().enter({
    inFlight: config.uploadsInFlight,
    waiting: config.uploadsWaiting,
    waitMs: config.uploadWaitMs,
  });
  try {
    const parsed = await parseUpload(request, config.maxUploadBytes, uploadTempRoot(config.dataDir));
    try {
      return await storeBatchFile(ctx, batch, parsed);
    } catch (err) {
      if (err instanceof AppError && REFUSED.has(err.code)) await recordRejection(batch.id, parsed, err.message);
      throw err;
    } finally {
      parsed.cleanup();
    }
  } finally {
    leave();
  }
}

async function storeBatchFile(ctx: LabContext, batch: BatchRow, parsed: ParsedUpload): Promise<BatchFileAnswer> {
  await applyBatchPixelSize(batch, parsed);
  if (batch.target !== "specimen-per-file") {
    const specimen = await findSpecimen(ctx, batch.specimenId!);
    const stored = await storeParsed(ctx, specimen.id, parsed, { batchId: batch.id });
    return { ...stored, batchId: batch.id, specimenLabel: specimen.label };
  }
  const m = await database();
  const study = await findStudy(ctx, batch.studyId!);
  const specimen = await m.Specimen.create({
    labId: ctx.labId,
    studyId: study.id,
    label: labelFromFilename(parsed.file.originalName),
    condition: batch.condition ?? "",
    stage: batch.stage,
    genotype: null,
    notes: `from batch “${batch.name}”`,
    createdBy: ctx.actor.userId,
  });
  let stored: ReceivedUpload;
  try {
    stored = await storeParsed(ctx, specimen.id, parsed, { batchId: batch.id });
  } catch (err) {
    // Its upload was not stored (storeUpload removed object and row), so the specimen goes too.
    await specimen
      .destroy()
      .catch((e) => console.error(`batch ${batch.id}: could not remove specimen ${specimen.id}`, e));
    throw err;
  }
  await recordAudit(m, {
    labId: ctx.labId,
    actor: ctx.actor,
    action: "specimen.created",
    targetType: "specimen",
    targetId: specimen.id,
    summary: `${ctx.actor.email} added specimen “${specimen.label}” (${specimen.condition}) to “${study.name}” for “${parsed.file.originalName}” of batch “${batch.name}”`,
  });
  return { ...stored, batchId: batch.id, specimenLabel: specimen.label };
}

async function recordRejection(batchId: string, parsed: ParsedUpload, message: string): Promise<void> {
  const m = await database();
  await m.BatchRejection.create({ batchId, filename: parsed.file.originalName, message }).catch((e) =>
    console.error(`batch ${batchId}: could not record the refusal of “${parsed.file.originalName}”`, e),
  );
}
