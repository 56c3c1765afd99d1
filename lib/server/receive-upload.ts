/**
 * An upload request: stream the file, judge its type by content, take the pixel size from the
 * file's metadata (or the uploader), then store object + row together.
 */
import { readFileSync } from "node:fs";
import { readPixelSize, sniffFileKind, type FileKind } from "@/lib/imaging";
import { pixelSizeSchema } from "@/lib/contracts/study";
import type { LabContext } from "./access";
import { AppError } from "./errors";
import { parseUpload } from "./multipart";
import { services } from "./services";
import { findSpecimen } from "./data/specimens";
import { storeUpload, type UploadDto } from "./data/uploads";

export const CONTENT_TYPES: Record<FileKind, string> = {
  png: "image/png",
  jpeg: "image/jpeg",
  tiff: "image/tiff",
  csv: "text/csv",
  tsv: "text/tab-separated-values",
};

const isImage = (kind: FileKind) => kind === "png" || kind === "jpeg" || kind === "tiff";

export async function receiveUpload(ctx: LabContext, specimenId: string, request: Request): Promise<UploadDto> {
  await findSpecimen(ctx, specimenId); // 404 before reading a byte of the body
  const parsed = await parseUpload(request, services().config.maxUploadBytes);
  try {
    const kind = sniffFileKind(parsed.head);
    if (!kind) {
      throw new AppError("bad_input", `“${parsed.file.originalName}” is not a PNG, JPEG or TIFF image nor a CSV/TSV table (judged by its content, not its name)`);
    }
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
    return await storeUpload(ctx, specimenId, {
      path: parsed.file.path,
      filename: parsed.file.originalName,
      sizeBytes: parsed.file.sizeBytes,
      sha256: parsed.file.sha256,
      kind: isImage(kind) ? "image" : "table",
      contentType: CONTENT_TYPES[kind],
      pixelSizeUm,
      pixelSizeSource,
    });
  } finally {
    parsed.cleanup();
  }
}
