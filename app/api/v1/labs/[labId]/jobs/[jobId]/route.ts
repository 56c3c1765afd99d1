import { cancelOwnJob } from "@/lib/server/jobs/job-rows";
import { json } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";
import { getJob } from "@/lib/server/jobs/queue";

export const runtime = "nodejs";

type P = { labId: string; jobId: string };

/** Status and progress of one job (poll this while it runs). */
export const GET = labRoute<P>("lab.read", async (ctx, _request, p) => json(await getJob(ctx.labId, p.jobId)));

/** Cancels a queued or running job (its requester or a lab manager). */
export const DELETE = labRoute<P>("job.cancel", async (ctx, _request, p) => json(await cancelOwnJob(ctx, p.jobId)));
