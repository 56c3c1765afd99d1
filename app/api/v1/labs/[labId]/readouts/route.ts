import { z } from "zod";
import { listReadouts, READOUT_SORTS } from "@/lib/server/readouts/readouts";
import { AppError } from "@/lib/server/errors";
import { json } from "@/lib/server/web/http";
import { labReadRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

const filterSchema = z.object({
  specimenId: z.uuid("specimenId must be a specimen id").optional(),
  uploadId: z.uuid("uploadId must be an upload id").optional(),
});

/** Readouts of the lab, newest first; `?specimenId=` or `?uploadId=` narrows them. */
export const GET = labReadRoute<{ labId: string }>("upload.read", async (ctx, request) => {
  const params = new URL(request.url).searchParams;
  const filter = filterSchema.safeParse({
    specimenId: params.get("specimenId") ?? undefined,
    uploadId: params.get("uploadId") ?? undefined,
  });
  if (!filter.success) throw new AppError("bad_input", filter.error.issues.map((i) => i.message).join("; "));
  return json(await listReadouts(ctx, filter.data, parseListQuery(request.url, READOUT_SORTS, "createdAt", "desc")));
});
