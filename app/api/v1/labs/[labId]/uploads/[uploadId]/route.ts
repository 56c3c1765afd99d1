import { deleteUpload, getUpload } from "@/lib/server/uploads/uploads";
import { json } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

type P = { labId: string; uploadId: string };

export const GET = labReadRoute<P>("upload.read", async (ctx, _request, p) => json(await getUpload(ctx, p.uploadId)));

export const DELETE = labRoute<P>("upload.delete", async (ctx, _request, p) => {
  await deleteUpload(ctx, p.uploadId);
  return new Response(null, { status: 204 });
});
