/** The background-job runner: queued → running → succeeded/failed/cancelled, with progress. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { cancelJob, enqueueJob, getJob, waitForJob } from "@/lib/server/jobs/queue";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
});
afterAll(async () => stack?.close());

describe("jobs", () => {
  it("runs a job to success and stores its result", async () => {
    const job = await enqueueJob({
      labId: w.labId,
      kind: "echo",
      payload: { ms: 50, value: 42 },
      requestedBy: w.people.scientist.userId,
    });
    const done = await waitForJob(job.id);
    expect(done).toMatchObject({ status: "succeeded", progress: 1, result: { echo: 42 }, error: null });
    expect(Date.parse(done.finishedAt!)).toBeGreaterThanOrEqual(Date.parse(done.startedAt!));
  });

  it("records why a job failed", async () => {
    const job = await enqueueJob({
      labId: w.labId,
      kind: "echo",
      payload: { ms: 0, fail: "the kinetics has no Turing region" },
      requestedBy: null,
    });
    expect(await waitForJob(job.id)).toMatchObject({
      status: "failed",
      error: "the kinetics has no Turing region",
      result: null,
    });
  });

  it("cancels a running job and reports progress while it runs", async () => {
    const job = await enqueueJob({ labId: w.labId, kind: "echo", payload: { ms: 3000 }, requestedBy: null });
    let seen = await getJob(w.labId, job.id);
    for (let i = 0; i < 100 && !(seen.status === "running" && seen.progress > 0); i++) {
      await new Promise((r) => setTimeout(r, 50));
      seen = await getJob(w.labId, job.id);
    }
    expect(seen.status).toBe("running");
    expect(seen.progressNote).toMatch(/^step \d+ of 10$/);
    await cancelJob(w.labId, job.id);
    expect(await waitForJob(job.id)).toMatchObject({ status: "cancelled", error: "the job was cancelled" });
  });

  it("a job of another lab is not found", async () => {
    const job = await enqueueJob({ labId: w.labId, kind: "echo", payload: {}, requestedBy: null });
    await expect(getJob(w.otherLabId, job.id)).rejects.toThrow("job not found");
  });
});
