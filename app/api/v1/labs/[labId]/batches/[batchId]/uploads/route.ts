import { receiveBatchFile } from "@/lib/server/batches/receive";
import { json } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/**
 * One file of the batch (multipart/form-data: `file`, optional `pixelSizeUm`), stored and its
 * readout started with the batch's settings (201). A refused file answers its error and is
 * listed in the batch's summary as failed, with the reason.
 */
export const POST = labRoute<{ labId: string; batchId: string }>("upload.create", async (ctx, request, p) =>
  json(await receiveBatchFile(ctx, p.batchId, request), 201),
);
