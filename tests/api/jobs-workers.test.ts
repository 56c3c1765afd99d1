/**
 * Separate worker processes behind the same job interface, on whichever database this run uses
 * (SQLite: the worker polls the file; PostgreSQL: pg-boss delivers): with no worker in this
 * process, a `npm run worker` process runs a queued job; a cancellation asked for here stops
 * the job in the other process; /api/health counts the live workers.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET } from "@/app/api/health/route";
import { cancelJob, enqueueJob, waitForJob } from "@/lib/server/jobs/queue";
import { stopJobs } from "@/lib/server/jobs/worker";
import { countLiveWorkers } from "@/lib/server/jobs/worker-registry";
import { database } from "@/lib/server/services";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";
import { killWorker, pollFor, startWorker, type WorkerProcess } from "../jobs/worker-processes";

let stack: TestStack;
let w: World;
let worker: WorkerProcess | undefined;

beforeAll(async () => {
  stack = await startTestStack();
  await stopJobs(); // as with JOBS_IN_WEB=0: this process only queues
  w = await makeWorld();
});
afterAll(async () => {
  if (worker) await killWorker(worker);
  await stack?.close();
});

describe("a separate worker process", () => {
  it(
    "runs a queued job, stops one cancelled from here, and is counted by /api/health",
    { timeout: 120_000 },
    async () => {
      const m = await database();
      await m.Worker.destroy({ where: {} }); // this process's own worker row from the stack's start
      worker = startWorker(stack, 1);
      const done = await enqueueJob({
        labId: w.labId,
        kind: "echo",
        payload: { ms: 100, value: "elsewhere" },
        requestedBy: null,
      });
      expect(await waitForJob(done.id, 60_000), worker.output()).toMatchObject({
        status: "succeeded",
        result: { echo: "elsewhere" },
      });
      const ran = await m.Job.findByPk(done.id);
      expect(ran!.workerId).toContain(`:${worker.child.pid}:`);

      const long = await enqueueJob({ labId: w.labId, kind: "echo", payload: { ms: 20_000 }, requestedBy: null });
      await pollFor("the long job running in the worker", 30_000, async () => {
        const j = await m.Job.findByPk(long.id);
        return j?.status === "running" && j.progress > 0 ? true : null;
      });
      await cancelJob(w.labId, long.id);
      // The worker sees the request on its next heartbeat (2 s), well before the job's 20 s.
      expect(await waitForJob(long.id, 15_000)).toMatchObject({ status: "cancelled", error: "the job was cancelled" });

      expect(await countLiveWorkers()).toBe(1);
      const health = await (await GET()).json();
      expect(health.jobs).toEqual({ queue: expect.stringMatching(/^(in-process|pg-boss)$/), liveWorkers: 1 });
    },
  );
});
