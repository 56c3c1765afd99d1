import { fitCreateSchema, FIT_SORTS } from "@/lib/contracts/fit";
import { listFits, startFit } from "@/lib/server/fits/fits";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

/** Fits of the lab, newest first (`?q=` filters by name). */
export const GET = labReadRoute<{ labId: string }>("lab.read", async (ctx, request) =>
  json(await listFits(ctx, parseListQuery(request.url, FIT_SORTS, "createdAt", "desc"))),
);

/** Checks a fit request and queues its job: 202 with the fit (poll its `jobId`). */
export const POST = labRoute<{ labId: string }>("fit.create", async (ctx, request) =>
  json(await startFit(ctx, await readJson(request, fitCreateSchema)), 202),
);
