import { comparisonQuerySchema } from "@/lib/contracts/readout";
import { compareConditions } from "@/lib/server/readouts/comparison";
import { AppError } from "@/lib/server/errors";
import { json } from "@/lib/server/web/http";
import { labReadRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Readouts grouped by condition (mean ± 95 % CI) and Welch's t-test between `?a=` and `?b=`. */
export const GET = labReadRoute<{ labId: string; studyId: string }>("upload.read", async (ctx, request, p) => {
  const params = new URL(request.url).searchParams;
  const q = comparisonQuerySchema.safeParse({
    a: params.get("a") ?? undefined,
    b: params.get("b") ?? undefined,
    replicate: params.get("replicate") ?? undefined,
  });
  if (!q.success) throw new AppError("bad_input", q.error.issues.map((i) => i.message).join("; "));
  return json(await compareConditions(ctx, p.studyId, q.data));
});
