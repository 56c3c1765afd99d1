/** A trivial job kind used by the worker's own tests: waits `ms`, checks cancellation, echoes. */
import "server-only";
import { JobCancelledError, type JobHandler } from "./types";

export const runEchoJob: JobHandler = async (job, ctx) => {
  const ms = Number(job.payload.ms ?? 0);
  const steps = 10;
  for (let i = 0; i < steps; i++) {
    if (ctx.signal.aborted) throw new JobCancelledError();
    await new Promise((r) => setTimeout(r, ms / steps));
    await ctx.progress((i + 1) / steps, `step ${i + 1} of ${steps}`);
  }
  if (job.payload.fail) throw new Error(String(job.payload.fail));
  return { echo: job.payload.value ?? null };
};
