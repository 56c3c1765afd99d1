import { Readable } from "node:stream";
import { openUploadContent } from "@/lib/server/data/uploads";
import { labRoute } from "@/lib/server/lab-route";

export const runtime = "nodejs";

/** The original file, byte for byte, as uploaded. */
export const GET = labRoute<{ labId: string; uploadId: string }>("upload.read", async (ctx, _request, p) => {
  const { upload, body } = await openUploadContent(ctx, p.uploadId);
  return new Response(Readable.toWeb(body as Readable) as ReadableStream, {
    headers: {
      "content-type": upload.contentType,
      "content-length": String(upload.sizeBytes),
      "content-disposition": `attachment; filename*=UTF-8''${encodeURIComponent(upload.filename)}`,
      "x-content-sha256": upload.sha256,
    },
  });
});
