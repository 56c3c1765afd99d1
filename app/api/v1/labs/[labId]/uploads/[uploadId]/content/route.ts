import { Readable } from "node:stream";
import { openUploadContent } from "@/lib/server/uploads/uploads";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Types the upload check produces; any other stored type is served as opaque bytes. */
const SAFE_TYPES = new Set(["image/png", "image/jpeg", "image/tiff", "text/csv", "text/tab-separated-values"]);

/** The original file, byte for byte, as uploaded: always a download, never rendered by the browser. */
export const GET = labRoute<{ labId: string; uploadId: string }>("upload.read", async (ctx, _request, p) => {
  const { upload, body } = await openUploadContent(ctx, p.uploadId);
  return new Response(Readable.toWeb(body as Readable) as ReadableStream, {
    headers: {
      "content-type": SAFE_TYPES.has(upload.contentType) ? upload.contentType : "application/octet-stream",
      "content-length": String(upload.sizeBytes),
      "content-disposition": `attachment; filename*=UTF-8''${encodeURIComponent(upload.filename)}`,
      "x-content-sha256": upload.sha256,
      "x-content-type-options": "nosniff",
    },
  });
});
