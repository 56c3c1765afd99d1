import { BATCH_SORTS, createBatch, listBatches } from "@/lib/server/batches/batches";
import { json, readJsonValue } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

/** The lab's batches, newest first, so a summary can be reopened. */
export const GET = labReadRoute("upload.read", async (ctx, request) =>
  json(await listBatches(ctx, parseListQuery(request.url, BATCH_SORTS, "createdAt", "desc"))),
);

/**
 * Starts a batch (201). JSON: `target` ("specimen" with `specimenId`; "specimen-per-file" or
 * "one-specimen" with `studyId`, `condition`, optional `stage`, and `specimenLabel` for
 * "one-specimen"), optional `name`, `pixelSizeUm` (µm/px for files without their own) and
 * `pixelSizeOverride` (use it for every file). Then send the files to …/batches/:id/uploads.
 */
export const POST = labRoute("upload.create", async (ctx, request) =>
  json(await createBatch(ctx, await readJsonValue(request)), 201),
);
