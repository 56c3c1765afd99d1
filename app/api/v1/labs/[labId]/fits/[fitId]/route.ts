import { getFit } from "@/lib/server/fits/fits";
import { json } from "@/lib/server/web/http";
import { labReadRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** One fit: stored spec, provenance, status, and the result once finished. */
export const GET = labReadRoute<{ labId: string; fitId: string }>("lab.read", async (ctx, _request, p) =>
  json(await getFit(ctx, p.fitId)),
);
