import { getBatchSummary } from "@/lib/server/batches/summary";
import { batchSummaryToCsv } from "@/lib/server/batches/summary-csv";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** The batch's summary as CSV, one row per file. */
export const GET = labRoute<{ labId: string; batchId: string }>("upload.read", async (ctx, _request, p) => {
  const s = await getBatchSummary(ctx, p.batchId);
  const name = s.name.replace(/[^A-Za-z0-9._-]+/g, "-").slice(0, 60) || "batch";
  return new Response(batchSummaryToCsv(s), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${name}.csv"`,
    },
  });
});
