import { listJobs } from "@/lib/server/jobs/job-rows";
import { json } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** The lab's recent jobs; `?mine=1` for the caller's own. */
export const GET = labRoute("lab.read", async (ctx, request) =>
  json({ items: await listJobs(ctx, new URL(request.url).searchParams.get("mine") === "1") }),
);
