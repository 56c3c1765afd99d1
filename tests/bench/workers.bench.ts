/**
 * Scale-out of jobs: BENCH_WORKERS_N (default 40) verification runs of 64² (Schnakenberg, the
 * spec of tests/api/runs.test.ts with a shorter end time) through one `npm run worker` process,
 * then through two, on PostgreSQL + pg-boss (a throwaway server, tests/support/postgres.ts).
 * Each worker runs one job at a time; the figures are wall time from queuing the first run to
 * the last one's end, and jobs per minute. On a machine with fewer free cores than workers the
 * second worker adds little: the figure says what this machine gives, not a promise.
 */
import type { BenchRow } from "./run";
import type { LabContext } from "../../lib/server/access";
import { waitForJob } from "../../lib/server/jobs/queue";
import { stopJobs } from "../../lib/server/jobs/worker";
import { startRun } from "../../lib/server/runs/runs";
import { database } from "../../lib/server/services";
import { startPostgres, TEST_PG_URL_ENV } from "../support/postgres";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld } from "../support/world";
import { killWorker, pollFor, startWorker, type WorkerProcess } from "../jobs/worker-processes";

const N = Number(process.env.BENCH_WORKERS_N ?? 40);
const RUN = {
  kinetics: "schnakenberg",
  parameters: { a: 0.1, b: 0.9, d: 20 },
  grid: { lengthUm: [100, 100], cells: [64, 64] },
  endTimeS: 100,
  noiseAmplitude: 0.01,
  snapshots: 2,
};

/** Queues N runs, waits for all of them; returns the wall time in s. */
async function runThrough(stack: TestStack, ctx: LabContext, workers: number): Promise<number> {
  const m = await database();
  const procs: WorkerProcess[] = [];
  try {
    await m.Worker.destroy({ where: {} });
    for (let i = 0; i < workers; i++) procs.push(startWorker(stack, 1));
    await pollFor(`${workers} live worker(s)`, 120_000, async () =>
      (await m.Worker.count()) >= workers ? true : null,
    );
    const t0 = Date.now();
    const jobIds: string[] = [];
    for (let i = 0; i < N; i++) jobIds.push((await startRun(ctx, { ...RUN, seed: i + 1 })).jobId!);
    for (const id of jobIds) {
      const job = await waitForJob(id, 3_600_000);
      if (job.status !== "succeeded") throw new Error(`run job ${id} ended ${job.status}: ${job.error}`);
    }
    return (Date.now() - t0) / 1000;
  } finally {
    for (const p of procs) await killWorker(p);
  }
}

export default async function bench(): Promise<BenchRow[]> {
  const server = await startPostgres();
  process.env[TEST_PG_URL_ENV] = server.adminUrl;
  process.env.MORPHOKIN_TEST_DB = "postgres";
  const stack = await startTestStack();
  try {
    await stopJobs(); // this process only queues
    const w = await makeWorld();
    const ctx: LabContext = { actor: w.people.modeller.actor, labId: w.labId, labName: "Bench", role: "modeller" };
    const rows: BenchRow[] = [];
    for (const workers of [1, 2]) {
      const wallS = await runThrough(stack, ctx, workers);
      const what = `${N} runs of 64² through ${workers} worker${workers > 1 ? "s" : ""}`;
      rows.push({ name: `workers: ${what}, wall time`, value: wallS, unit: "s" });
      rows.push({
        name: `workers: ${what}, throughput`,
        value: (N / wallS) * 60,
        unit: "jobs/min",
        target: workers === 2 ? "> 1 worker's, with 2 free cores" : undefined,
      });
    }
    return rows;
  } finally {
    await stack.close();
    await server.stop();
  }
}
