import { simulationRunRequestSchema } from "@/lib/contracts/simulation-run";
import { listRuns, RUN_SORTS, startRun } from "@/lib/server/runs/runs";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

/** Verification runs of the lab, newest first. */
export const GET = labReadRoute<{ labId: string }>("lab.read", async (ctx, request) =>
  json(await listRuns(ctx, parseListQuery(request.url, RUN_SORTS, "createdAt", "desc"))),
);

/** Checks a run (400/422 with the field and limit) and queues it; answers 202 with the run. */
export const POST = labRoute<{ labId: string }>("run.create", async (ctx, request) =>
  json(await startRun(ctx, await readJson(request, simulationRunRequestSchema)), 202),
);
