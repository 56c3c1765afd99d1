import { rerunFit } from "@/lib/server/fits/fits";
import { json } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Runs the stored spec again as a new fit (202); the numbers must come out the same. */
export const POST = labRoute<{ labId: string; fitId: string }>("fit.create", async (ctx, _request, p) =>
  json(await rerunFit(ctx, p.fitId), 202),
);
