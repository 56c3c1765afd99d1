/**
 * An upload request: stream the file, judge its type by content, take the pixel size from the
 * file's metadata (or the uploader), then store object + row together.
 */
import { readFileSync } from "node:fs";
import sharp from "sharp";
import { readPixelSize, sniffFileKind, type FileKind } from "@/lib/imaging";
import { MAX_READOUT_PIXELS } from "@/lib/readout";
import { pixelSizeSchema } from "@/lib/contracts/study";
import type { LabContext } from "./access";
import { AppError } from "./errors";
import { parseUpload } from "./multipart";
import { services } from "./services";
import { findSpecimen } from "./data/specimens";
import { startReadout, type ReadoutDto } from "./data/readouts";
import { storeUpload, type UploadDto } from "./data/uploads";

export const CONTENT_TYPES: Record<FileKind, string> = {
  png: "image/png",
  jpeg: "image/jpeg",
  tiff: "image/tiff",
  csv: "text/csv",
  tsv: "text/tab-separated-values",
};

const isImage = (kind: FileKind) => kind === "png" || kind === "jpeg" || kind === "tiff";

/**
 * Refuses an image above the readout's pixel limit from its header alone (sharp reads no pixel
 * data for metadata). An unreadable header is left to the readout, which fails with the reason
 * while the upload is kept.
 */
async function checkPixelLimit(path: string, name: string): Promise<void> {
  const meta = await sharp(path, { limitInputPixels: false }).metadata().catch(() => null);
  const px = (meta?.width ?? 0) * (meta?.height ?? 0);
  if (px > MAX_READOUT_PIXELS) {
    throw new AppError("too_large", `“${name}” is ${meta!.width}×${meta!.height} = ${px} pixels, above the limit of ${MAX_READOUT_PIXELS} pixels (8192×8192); crop or bin it before uploading`);
  }
}

/** The stored upload and the readout it started (null when it could not start; `readoutError` says why). */
export type ReceivedUpload = UploadDto & { readout: ReadoutDto | null; readoutError: string | null };

export async function receiveUpload(ctx: LabContext, specimenId: string, request: Request): Promise<ReceivedUpload> {
  await findSpecimen(ctx, specimenId); // 404 before reading a byte of the body
  const parsed = await parseUpload(request, services().config.maxUploadBytes);
  try {
    const kind = sniffFileKind(parsed.head);
    if (!kind) {
      throw new AppError("bad_input", `“${parsed.file.originalName}” is not a PNG, JPEG or TIFF image nor a CSV/TSV table (judged by its content, not its name)`);
    }
    if (isImage(kind)) await checkPixelLimit(parsed.file.path, parsed.file.originalName);
    let typed: number | null = null;
    if (parsed.fields.pixelSizeUm !== undefined && parsed.fields.pixelSizeUm.trim() !== "") {
      const p = pixelSizeSchema.safeParse(parsed.fields.pixelSizeUm);
      if (!p.success) throw new AppError("bad_input", `pixelSizeUm: ${p.error.issues[0].message}`);
      typed = p.data;
    }
    let pixelSizeUm: number | null = typed;
    let pixelSizeSource: string | null = typed === null ? null : "uploader";
    if (isImage(kind) && typed === null) {
      const fromFile = readPixelSize(readFileSync(parsed.file.path), kind);
      if (fromFile.pixelSizeUm === null) {
        throw new AppError("bad_input", `pixelSizeUm: “${parsed.file.originalName}” carries no pixel size in its metadata${fromFile.pixelSizeNote ? ` (${fromFile.pixelSizeNote})` : ""}; enter the pixel size in µm/px`);
      }
      pixelSizeUm = fromFile.pixelSizeUm;
      pixelSizeSource = fromFile.pixelSizeSource;
    }
    const upload = await storeUpload(ctx, specimenId, {
      path: parsed.file.path,
      filename: parsed.file.originalName,
      sizeBytes: parsed.file.sizeBytes,
      sha256: parsed.file.sha256,
      kind: isImage(kind) ? "image" : "table",
      contentType: CONTENT_TYPES[kind],
      pixelSizeUm,
      pixelSizeSource,
    });
    // Every upload gets its readout with default settings, as a background job.
    try {
      return { ...upload, readout: await startReadout(ctx, upload.id, {}), readoutError: null };
    } catch (err) {
      if (!(err instanceof AppError)) throw err;
      return { ...upload, readout: null, readoutError: err.message };
    }
  } finally {
    parsed.cleanup();
  }
}
