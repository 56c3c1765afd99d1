import { getRun } from "@/lib/server/runs/runs";
import { json } from "@/lib/server/web/http";
import { labReadRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** One run: status and progress while it runs, then the plan, the result and links to its files. */
export const GET = labReadRoute<{ labId: string; runId: string }>("lab.read", async (ctx, _request, p) =>
  json(await getRun(ctx, p.runId)),
);
