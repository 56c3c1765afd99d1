import { listUploads, UPLOAD_SORTS } from "@/lib/server/uploads/uploads";
import { json } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";
import { receiveUpload } from "@/lib/server/uploads/receive";

export const runtime = "nodejs";

type P = { labId: string; specimenId: string };

export const GET = labReadRoute<P>("upload.read", async (ctx, request, p) =>
  json(await listUploads(ctx, p.specimenId, parseListQuery(request.url, UPLOAD_SORTS, "createdAt", "desc"))),
);

/** multipart/form-data: `file` (PNG, JPEG, TIFF, CSV, TSV or XLSX) and optional `pixelSizeUm` (µm/px). */
export const POST = labRoute<P>("upload.create", async (ctx, request, p) =>
  json(await receiveUpload(ctx, p.specimenId, request), 201),
);
