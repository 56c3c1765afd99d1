import { deleteUpload, getUpload } from "@/lib/server/data/uploads";
import { json } from "@/lib/server/http";
import { labRoute } from "@/lib/server/lab-route";

export const runtime = "nodejs";

type P = { labId: string; uploadId: string };

export const GET = labRoute<P>("upload.read", async (ctx, _request, p) => json(await getUpload(ctx, p.uploadId)));

export const DELETE = labRoute<P>("upload.delete", async (ctx, _request, p) => {
  await deleteUpload(ctx, p.uploadId);
  return new Response(null, { status: 204 });
});
