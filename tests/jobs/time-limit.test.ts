/**
 * A job past its kind's time limit is stopped by the worker and fails saying so (the limit and
 * what to do), its derived row with it; a cancellation is still a cancellation.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { enqueueJob, waitForJob } from "@/lib/server/jobs/queue";
import { timeLimitMessage } from "@/lib/server/jobs/run-job";
import { JOB_CODE } from "@/lib/server/jobs/wiring";
import { giveWorkerJobCode, resumeJobs } from "@/lib/server/jobs/worker";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
const LIMIT_S = 0.5; // design choice for this test: well below the echo job's 5 s below

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  giveWorkerJobCode({ ...JOB_CODE, timeLimitsS: { ...JOB_CODE.timeLimitsS, echo: LIMIT_S } });
  resumeJobs();
});
afterAll(async () => {
  giveWorkerJobCode(JOB_CODE);
  await stack?.close();
});

describe("time limit per job kind", () => {
  it("stops a job that runs past it and fails it with the limit in the message", async () => {
    const job = await enqueueJob({ labId: w.labId, kind: "echo", payload: { ms: 5000 }, requestedBy: null });
    expect(await waitForJob(job.id, 20_000)).toMatchObject({
      status: "failed",
      error: timeLimitMessage("echo", LIMIT_S),
    });
    expect(timeLimitMessage("simulation", 7200)).toBe(
      "the simulation job ran longer than its limit of 120 minutes and was stopped; make it smaller or start it again when the server is less busy",
    );
  });
});
