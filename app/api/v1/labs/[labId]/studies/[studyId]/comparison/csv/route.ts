import { comparisonQuerySchema } from "@/lib/contracts/readout";
import { compareConditions } from "@/lib/server/readouts/comparison";
import { comparisonToCsv } from "@/lib/server/readouts/comparison-csv";
import { AppError } from "@/lib/server/errors";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** The condition comparison as CSV (one row per readout used; Welch's result in # lines). */
export const GET = labRoute<{ labId: string; studyId: string }>("upload.read", async (ctx, request, p) => {
  const params = new URL(request.url).searchParams;
  const q = comparisonQuerySchema.safeParse({
    a: params.get("a") ?? undefined,
    b: params.get("b") ?? undefined,
    replicate: params.get("replicate") ?? undefined,
  });
  if (!q.success) throw new AppError("bad_input", q.error.issues.map((i) => i.message).join("; "));
  const c = await compareConditions(ctx, p.studyId, q.data);
  const name = c.studyName.replace(/[^A-Za-z0-9._-]+/g, "-").slice(0, 60) || "study";
  return new Response(comparisonToCsv(c), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${name}-comparison.csv"`,
    },
  });
});
