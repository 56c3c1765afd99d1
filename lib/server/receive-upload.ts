/** An upload request: stream the file, judge its type by content, store object + row together. */
import { CONTENT_TYPES, isImageKind, sniffFileKind } from "@/lib/files/sniff";
import { pixelSizeSchema } from "@/lib/contracts/study";
import type { LabContext } from "./access";
import { AppError } from "./errors";
import { parseUpload } from "./multipart";
import { services } from "./services";
import { findSpecimen } from "./data/specimens";
import { storeUpload, type UploadDto } from "./data/uploads";

export async function receiveUpload(ctx: LabContext, specimenId: string, request: Request): Promise<UploadDto> {
  await findSpecimen(ctx, specimenId); // 404 before reading a byte of the body
  const parsed = await parseUpload(request, services().config.maxUploadBytes);
  try {
    const kind = sniffFileKind(parsed.head);
    if (!kind) {
      throw new AppError("bad_input", `“${parsed.file.originalName}” is not a PNG, JPEG or TIFF image nor a CSV/TSV table (judged by its content, not its name)`);
    }
    let pixelSizeUm: number | null = null;
    if (parsed.fields.pixelSizeUm !== undefined && parsed.fields.pixelSizeUm !== "") {
      const p = pixelSizeSchema.safeParse(parsed.fields.pixelSizeUm);
      if (!p.success) throw new AppError("bad_input", `pixelSizeUm: ${p.error.issues[0].message}`);
      pixelSizeUm = p.data;
    }
    return await storeUpload(ctx, specimenId, {
      path: parsed.file.path,
      filename: parsed.file.originalName,
      sizeBytes: parsed.file.sizeBytes,
      sha256: parsed.file.sha256,
      kind: isImageKind(kind) ? "image" : "table",
      contentType: CONTENT_TYPES[kind],
      pixelSizeUm,
      pixelSizeSource: pixelSizeUm === null ? null : "uploader",
    });
  } finally {
    parsed.cleanup();
  }
}
