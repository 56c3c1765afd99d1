import { getBatchSummary } from "@/lib/server/batches/summary";
import { json } from "@/lib/server/web/http";
import { labReadRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** The batch with one row per file: λ ± u (µm), symmetry, significance, status; `done` once all are read. */
export const GET = labReadRoute<{ labId: string; batchId: string }>("upload.read", async (ctx, _request, p) =>
  json(await getBatchSummary(ctx, p.batchId)),
);
