import { listUploads, UPLOAD_SORTS } from "@/lib/server/data/uploads";
import { json } from "@/lib/server/http";
import { labRoute } from "@/lib/server/lab-route";
import { parseListQuery } from "@/lib/server/list";
import { receiveUpload } from "@/lib/server/receive-upload";

export const runtime = "nodejs";

type P = { labId: string; specimenId: string };

export const GET = labRoute<P>("upload.read", async (ctx, request, p) =>
  json(await listUploads(ctx, p.specimenId, parseListQuery(request.url, UPLOAD_SORTS, "createdAt", "desc"))),
);

/** multipart/form-data: `file` (PNG, JPEG, TIFF, CSV or TSV) and optional `pixelSizeUm` (µm/px). */
export const POST = labRoute<P>("upload.create", async (ctx, request, p) =>
  json(await receiveUpload(ctx, p.specimenId, request), 201),
);
