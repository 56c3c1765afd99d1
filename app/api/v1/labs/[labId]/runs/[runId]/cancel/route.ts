import { cancelRun } from "@/lib/server/runs/runs";
import { json } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Cancels a queued or running run (its creator or a lab manager). */
export const POST = labRoute<{ labId: string; runId: string }>("job.cancel", async (ctx, _request, p) =>
  json(await cancelRun(ctx, p.runId)),
);
