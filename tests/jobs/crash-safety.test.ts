/**
 * Crash safety of jobs on PostgreSQL + pg-boss with separate worker processes (issue 12): two
 * `npm run worker` processes take 30 mixed small jobs (image readouts, verification runs, echo
 * jobs); one worker is killed with SIGKILL while it runs a job. Every job ends exactly once —
 * succeeded, or "failed: the worker stopped …" after its retries — none is left "queued" or
 * "running"; each job's row (readout, run) ends in its job's state; and the objects in storage
 * are exactly those the rows name (no torn object of the killed attempt, none missing).
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { LabContext } from "@/lib/server/access";
import { enqueueJob } from "@/lib/server/jobs/queue";
import { WORKER_STOPPED_TWICE } from "@/lib/server/jobs/recovery";
import { stopJobs } from "@/lib/server/jobs/worker";
import { countLiveWorkers } from "@/lib/server/jobs/worker-registry";
import { startRun } from "@/lib/server/runs/runs";
import { database, services } from "@/lib/server/services";
import { startPostgres, TEST_PG_URL_ENV, type PostgresServer } from "../support/postgres";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";
import { TINY_RUN } from "../api/permission-cases/runs";
import { killWorker, pollFor, queueImageReadout, startWorker, type WorkerProcess } from "./worker-processes";

let server: PostgresServer | null = null;
let stack: TestStack;
let w: World;
let tmp: string;
const workers: WorkerProcess[] = [];
const savedEnv = { db: process.env.MORPHOKIN_TEST_DB, url: process.env[TEST_PG_URL_ENV] };

beforeAll(async () => {
  // A server of its own unless the run already has one (the "postgres" vitest project).
  if (!process.env[TEST_PG_URL_ENV]) {
    server = await startPostgres();
    process.env[TEST_PG_URL_ENV] = server.adminUrl;
  }
  process.env.MORPHOKIN_TEST_DB = "postgres";
  stack = await startTestStack();
  await stopJobs(); // this process only queues; the two worker processes run every job
  w = await makeWorld();
  tmp = mkdtempSync(path.join(tmpdir(), "morphokin-crash-test-"));
}, 120_000);

afterAll(async () => {
  for (const p of workers) await killWorker(p);
  await stack?.close();
  await server?.stop();
  process.env.MORPHOKIN_TEST_DB = savedEnv.db;
  if (savedEnv.url === undefined) delete process.env[TEST_PG_URL_ENV];
  else process.env[TEST_PG_URL_ENV] = savedEnv.url;
  if (tmp) rmSync(tmp, { recursive: true, force: true });
});

describe("two worker processes, one killed mid-job", () => {
  it("ends every one of 30 mixed jobs exactly once, and rows and objects match", { timeout: 600_000 }, async () => {
    expect(services().jobs.name).toBe("pg-boss");
    const m = await database();
    const scientist: LabContext = {
      actor: w.people.scientist.actor,
      labId: w.labId,
      labName: "Test Lab",
      role: "scientist",
    };
    const modeller: LabContext = {
      actor: w.people.modeller.actor,
      labId: w.labId,
      labName: "Test Lab",
      role: "modeller",
    };

    workers.push(startWorker(stack, 2), startWorker(stack, 2));
    await pollFor("two live workers", 60_000, async () => ((await countLiveWorkers()) >= 2 ? true : null));

    const jobIds: string[] = [];
    for (let i = 0; i < 10; i++) {
      jobIds.push(await queueImageReadout(scientist, tmp, i));
      jobIds.push((await startRun(modeller, { ...TINY_RUN, seed: i + 1 })).jobId!);
      const echo = await enqueueJob({
        labId: w.labId,
        kind: "echo",
        payload: { ms: 3000, value: i },
        requestedBy: null,
      });
      jobIds.push(echo.id);
    }
    expect(jobIds).toHaveLength(30);

    // Kill the first worker while it runs a job (its id carries its pid: lib/server/jobs/worker-registry.ts).
    const victim = workers[0];
    const victimTag = `:${victim.child.pid}:`;
    const killedJobs = await pollFor("a job running in the first worker", 120_000, async () => {
      const running = await m.Job.findAll({ where: { status: "running" } });
      const mine = running.filter((j) => j.workerId?.includes(victimTag)).map((j) => j.id);
      return mine.length > 0 ? mine : null;
    });
    await killWorker(victim);

    // Poll for the jobs themselves: every one leaves queued/running.
    const ended = await pollFor("every job ended", 480_000, async () => {
      const rows = await m.Job.findAll({ where: { id: jobIds } });
      return rows.every((j) => j.status !== "queued" && j.status !== "running") ? rows : null;
    });
    const problems = ended
      .filter((j) => !(j.status === "succeeded" || (j.status === "failed" && j.error === WORKER_STOPPED_TWICE)))
      .map((j) => `${j.kind} ${j.id}: ${j.status} ${j.error}`);
    expect(problems, workers[1].output()).toEqual([]);
    // Once: never started more than once after the kill, and the killed worker's jobs were taken up again.
    for (const j of ended) expect(j.restarts).toBeLessThanOrEqual(1);
    for (const id of killedJobs) {
      const j = ended.find((x) => x.id === id)!;
      expect(j.restarts).toBe(1);
      if (j.status === "succeeded") expect(j.workerId).not.toContain(victimTag);
    }

    // Each derived row ends in its job's state.
    const readouts = await m.Readout.findAll({ where: { labId: w.labId } });
    const runs = await m.SimulationRun.findAll({ where: { labId: w.labId } });
    expect(readouts).toHaveLength(10);
    expect(runs).toHaveLength(10);
    for (const row of [...readouts, ...runs]) {
      const job = ended.find((j) => j.id === row.jobId)!;
      expect(row.status).toBe(job.status);
    }

    // Objects: exactly the uploads and the derived objects the succeeded rows name.
    const uploads = await m.Upload.findAll({ where: { labId: w.labId } });
    const expected = new Set<string>(uploads.map((u) => u.storageKey));
    for (const r of readouts) for (const key of Object.values(r.derivedKeys ?? {})) expected.add(key);
    for (const r of runs) for (const key of Object.values(r.fileKeys ?? {})) expected.add(key);
    const stored = new Set((await services().store.list("")).map((o) => o.key));
    expect([...stored].sort()).toEqual([...expected].sort());

    // The killed worker no longer counts as live (its row was removed when its job was taken up).
    await pollFor("one live worker", 30_000, async () => ((await countLiveWorkers()) === 1 ? true : null));
  });
});
