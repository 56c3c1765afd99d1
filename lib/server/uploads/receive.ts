/**
 * An upload request: wait for a slot, stream the file, judge its type by content, take the pixel
 * size from the file's metadata (or the uploader), then store object + row + readout together.
 */
import "server-only";
import { readFile } from "node:fs/promises";
import { openImageFile, READ_WHOLE_MAX_BYTES } from "@/lib/workers/image-file";
import sharp from "sharp";
import {
  MAX_DECODE_PIXELS,
  readImageLayout,
  readPixelSize,
  sniffFileKind,
  type FileKind,
  type ImageLayout,
} from "@/lib/imaging";
import { isZip } from "@/lib/spacing";
import { pixelSizeSchema } from "@/lib/contracts/study";
import { authorize, type LabContext } from "../access";
import { AppError } from "../errors";
import { uploadGate } from "./back-pressure";
import { parseUpload, uploadTempRoot, type ParsedUpload } from "./multipart";
import { services } from "../services";
import { findSpecimen } from "../studies/specimens";
import { queueReadout, toReadoutDto, type ReadoutDto } from "../readouts/readouts";
import { resolveStartSettings, type StoredReadoutSettings } from "../readouts/settings";
import { storeUpload, type UploadDto } from "./uploads";

export const CONTENT_TYPES: Record<FileKind, string> = {
  png: "image/png",
  jpeg: "image/jpeg",
  tiff: "image/tiff",
  csv: "text/csv",
  tsv: "text/tab-separated-values",
  xlsx: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
};

const isImage = (kind: FileKind) => kind === "png" || kind === "jpeg" || kind === "tiff";

/**
 * Refuses an image above the readout's pixel limit from its header alone (sharp reads no pixel
 * data for metadata). An unreadable header is left to the readout, which fails with the reason
 * while the upload is kept.
 */
async function checkPixelLimit(path: string, name: string): Promise<void> {
  const meta = await sharp(path, { limitInputPixels: false })
    .metadata()
    .catch(() => null);
  const px = (meta?.width ?? 0) * (meta?.height ?? 0);
  if (px > MAX_DECODE_PIXELS) {
    throw new AppError(
      "too_large",
      `“${name}” is ${meta!.width}×${meta!.height} = ${px} pixels, above the limit of ${MAX_DECODE_PIXELS} pixels (about 31 600 × 31 600); crop or bin it before uploading`,
    );
  }
}

/** The stored upload and the readout it started (null when it could not start; `readoutError` says why). */
export type ReceivedUpload = UploadDto & { readout: ReadoutDto | null; readoutError: string | null };

/**
 * One upload, start to end. A slot of the upload gate is taken first (a 503 with Retry-After when
 * the server is saturated, before the body is read); the upload and its readout are then stored
 * together (see `storeUpload`).
 */
export async function receiveUpload(ctx: LabContext, specimenId: string, request: Request): Promise<ReceivedUpload> {
  const { config } = services();
  const leave = await uploadGate().enter({
    inFlight: config.uploadsInFlight,
    waiting: config.uploadsWaiting,
    waitMs: config.uploadWaitMs,
  });
  try {
    await findSpecimen(ctx, specimenId); // 404 before reading a byte of the body
    const parsed = await parseUpload(request, config.maxUploadBytes, uploadTempRoot(config.dataDir));
    try {
      return await storeParsed(ctx, specimenId, parsed);
    } finally {
      parsed.cleanup();
    }
  } finally {
    leave();
  }
}

/** Stores a parsed upload (`extra`: what a batch adds to the upload row). */
export async function storeParsed(
  ctx: LabContext,
  specimenId: string,
  parsed: ParsedUpload,
  extra: { batchId?: string } = {},
): Promise<ReceivedUpload> {
  // A workbook's parts may lie beyond the first kilobytes: a ZIP is judged by its central directory
  // (a very large one by its local headers: its bytes are not held whole).
  const wholeZip = isZip(parsed.head) && parsed.file.sizeBytes <= READ_WHOLE_MAX_BYTES;
  const kind = sniffFileKind(wholeZip ? await readFile(parsed.file.path) : parsed.head);
  if (!kind) {
    throw new AppError(
      "bad_input",
      `“${parsed.file.originalName}” is not a PNG, JPEG or TIFF image nor a CSV/TSV or XLSX table (judged by its content, not its name)`,
    );
  }
  if (isImage(kind)) await checkPixelLimit(parsed.file.path, parsed.file.originalName);
  let typed: number | null = null;
  if (parsed.fields.pixelSizeUm !== undefined && parsed.fields.pixelSizeUm.trim() !== "") {
    const p = pixelSizeSchema.safeParse(parsed.fields.pixelSizeUm);
    if (!p.success)
      throw new AppError("bad_input", `pixelSizeUm: ${p.error.issues[0].message}`, { field: "pixelSizeUm" });
    typed = p.data;
  }
  let pixelSizeUm: number | null = typed;
  let pixelSizeSource: string | null = typed === null ? null : "uploader";
  let imageLayout: ImageLayout | null = null;
  // Headers only, read by ranges (a slide scan is never held whole): channels, planes and time
  // points, shown with the upload and checked before a readout, and the pixel size.
  const image = isImage(kind) ? openImageFile(parsed.file.path) : null;
  let fromFile: ReturnType<typeof readPixelSize> | null = null;
  try {
    if (image) imageLayout = await readImageLayout(image);
    if (image && typed === null) fromFile = readPixelSize(image, kind);
  } finally {
    image?.close();
  }
  if (fromFile) {
    if (fromFile.pixelSizeUm === null) {
      throw new AppError(
        "bad_input",
        `pixelSizeUm: “${parsed.file.originalName}” carries no pixel size in its metadata${fromFile.pixelSizeNote ? ` (${fromFile.pixelSizeNote})` : ""}; enter the pixel size in µm/px`,
        { field: "pixelSizeUm" },
      );
    }
    pixelSizeUm = fromFile.pixelSizeUm;
    pixelSizeSource = fromFile.pixelSizeSource;
  }
  const file = {
    path: parsed.file.path,
    filename: parsed.file.originalName,
    sizeBytes: parsed.file.sizeBytes,
    sha256: parsed.file.sha256,
    kind: isImage(kind) ? ("image" as const) : ("table" as const),
    contentType: CONTENT_TYPES[kind],
    pixelSizeUm,
    pixelSizeSource,
    ...extra,
    imageLayout,
  };
  // Every upload gets its readout with default settings, as a background job, written in the same
  // transaction that makes the upload visible. Settings that cannot start one keep the upload.
  let settings: StoredReadoutSettings | null = null;
  let readoutError: string | null = null;
  try {
    authorize(ctx, "readout.create");
    settings = resolveStartSettings(file, {});
  } catch (err) {
    if (!(err instanceof AppError)) throw err;
    readoutError = err.message;
  }
  const { also: readoutRow, ...upload } = await storeUpload(
    ctx,
    specimenId,
    file,
    settings ? (row, transaction) => queueReadout(ctx, row, settings, transaction) : undefined,
  );
  return { ...upload, readout: readoutRow ? await toReadoutDto(readoutRow) : null, readoutError };
}
