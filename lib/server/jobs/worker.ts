/**
 * The worker: takes queued jobs and runs them in this process, several at a time (its
 * concurrency: WORKER_CONCURRENCY in `npm run worker`, JOB_CONCURRENCY in the web server, default
 * one). It knows no handler itself: the composition root (lib/server/jobs/wiring.ts) hands it the
 * kind → handler map with `giveWorkerJobCode`. Jobs reach it through the delivery chosen in
 * services.ts: in-process, it takes the oldest queued row (woken by the local bus, and polling
 * for jobs queued by other processes); with pg-boss, it takes the jobs pg-boss hands it.
 *
 * While it runs it keeps a heartbeat (worker-registry.ts), stops its jobs whose cancellation was
 * asked for from another process, and takes up jobs of workers that stopped (recovery.ts) — at
 * start-up (instrumentation.ts → lib/server/startup.ts) and on every few heartbeats.
 */
import "server-only";
import { Op } from "sequelize";
import { database, services } from "../services";
import { listenForCancel, listenForQueued } from "./local-bus";
import type { JobRow } from "./queue";
import { recoverInterruptedJobs, type RecoveryReport } from "./recovery";
import { runClaimedJob, type JobCode } from "./run-job";
import { beat, HEARTBEAT_MS, newWorkerId, removeLongGoneWorkers, type WorkerRole } from "./worker-registry";

interface WorkerState {
  code?: JobCode;
  id: string | null;
  role: WorkerRole;
  concurrency?: number;
  running: Map<string, AbortController>;
  /** The one recovery of this process (start-up hook or first kick, whichever comes first). */
  recovery?: Promise<RecoveryReport>;
  kicking: boolean;
  stopped: boolean;
  finishing: Set<Promise<void>>;
  listening: boolean;
  heartbeat?: ReturnType<typeof setInterval>;
  beats: number;
  stopConsuming?: () => Promise<void>;
}
const g = globalThis as unknown as { __morphokinJobs?: WorkerState };
const state: WorkerState = (g.__morphokinJobs ??= {
  id: null,
  role: "web",
  running: new Map(),
  kicking: false,
  stopped: false,
  finishing: new Set(),
  listening: false,
  beats: 0,
});
const concurrency = () => state.concurrency ?? services().config.jobConcurrency;
const usesPgBoss = () => services().jobs.name === "pg-boss";

/** Gives this process's worker its handlers (the composition root calls it) and starts listening. */
export function giveWorkerJobCode(code: JobCode, options: { role?: WorkerRole; concurrency?: number } = {}): void {
  state.code = code;
  if (options.role) state.role = options.role;
  if (options.concurrency) state.concurrency = options.concurrency;
  state.id ??= newWorkerId(state.role);
  if (state.listening) return;
  state.listening = true;
  listenForQueued(() => kickJobs());
  listenForCancel((jobId) => {
    const controller = state.running.get(jobId);
    controller?.abort();
    return controller !== undefined;
  });
}

/** This process's worker id (null before it was given its handlers). */
export const workerId = () => state.id;

/** Recovers interrupted jobs once per process, then starts queued jobs. */
export async function recoverJobs(): Promise<RecoveryReport> {
  const report = await recoverOnce();
  kickJobs();
  return report;
}

/** The process's one recovery; a failed one (database unreachable) is tried again by the next call. */
function recoverOnce(): Promise<RecoveryReport> {
  const code = state.code;
  if (!code) return Promise.resolve({ requeued: [], failed: [] });
  return (state.recovery ??= (async () => {
    await beat(state.id!, state.role, concurrency());
    const report = await recoverInterruptedJobs(code, state.id, [...state.running.keys()]);
    await redeliverQueuedJobs();
    return report;
  })().catch((err: unknown) => {
    state.recovery = undefined;
    throw err;
  }));
}

/**
 * Hands every queued job to the queue engine again (pg-boss): a job queued by a process that
 * stopped between writing its row and handing it over, or written "queued" by an older version,
 * would otherwise wait forever. A job delivered twice runs once (its row is claimed once).
 */
async function redeliverQueuedJobs(): Promise<void> {
  if (!usesPgBoss()) return; // the in-process worker reads queued rows itself
  const m = await database();
  const queued = await m.Job.findAll({ where: { status: "queued" }, attributes: ["id", "kind"] });
  for (const job of queued) await services().jobs.deliver({ id: job.id, kind: job.kind });
}

/** Claims a queued job for this worker; false when another worker (or a cancel) was first. */
async function claim(row: JobRow): Promise<boolean> {
  const m = await database();
  const [claimed] = await m.Job.update(
    { status: "running", startedAt: new Date(), progress: 0, workerId: state.id },
    { where: { id: row.id, status: "queued" } },
  );
  return claimed > 0;
}

/** Runs a claimed job; resolves when it has ended and is recorded. */
function run(row: JobRow): Promise<void> {
  const controller = new AbortController();
  state.running.set(row.id, controller);
  const done: Promise<void> = runClaimedJob(state.code!, row, controller).finally(() => {
    state.running.delete(row.id);
    state.finishing.delete(done);
    kickJobs();
  });
  state.finishing.add(done);
  return done;
}

/** pg-boss handed this worker a job: run it if it is still queued (a re-delivery may find it taken). */
export async function takeDeliveredJob(jobId: string): Promise<void> {
  if (state.stopped || !state.code) throw new Error("this worker is stopping");
  const m = await database();
  const row = await m.Job.findByPk(jobId);
  if (!row || !(await claim(row))) return;
  await run(row);
}

/** Starts queued jobs while there is capacity. Safe to call often; does nothing without handlers. */
export function kickJobs(): void {
  if (state.kicking || state.stopped || !state.code) return;
  state.kicking = true;
  void (async () => {
    try {
      await recoverOnce();
      startHeartbeat();
      if (usesPgBoss()) {
        state.stopConsuming ??= await services().jobs.consume!(concurrency(), takeDeliveredJob);
        return;
      }
      const m = await database();
      while (state.running.size < concurrency() && !state.stopped) {
        const next = await m.Job.findOne({ where: { status: "queued" }, order: [["createdAt", "asc"]] });
        if (!next) break;
        if (await claim(next)) void run(next);
      }
    } catch (err) {
      console.error("job worker:", err);
    } finally {
      state.kicking = false;
    }
  })();
}

/** Heartbeat, cancellations asked for elsewhere, jobs of stopped workers, jobs queued elsewhere. */
function startHeartbeat(): void {
  if (state.heartbeat) return;
  state.heartbeat = setInterval(
    () => void tick().catch((err) => console.error("job worker heartbeat:", err)),
    HEARTBEAT_MS,
  );
  state.heartbeat.unref();
}

async function tick(): Promise<void> {
  if (state.stopped || !state.code) return;
  await beat(state.id!, state.role, concurrency());
  const m = await database();
  if (state.running.size > 0) {
    const asked = await m.Job.findAll({
      where: { id: [...state.running.keys()], cancelRequestedAt: { [Op.ne]: null } },
      attributes: ["id"],
    });
    for (const j of asked) state.running.get(j.id)?.abort();
  }
  if (++state.beats % 2 === 0) await recoverInterruptedJobs(state.code, state.id, [...state.running.keys()]);
  if (state.beats % 900 === 0) await removeLongGoneWorkers(); // every half hour

  kickJobs();
}

/** Cancels running jobs and waits for them to record it; no new job starts until `resumeJobs`. */
export async function stopJobs(): Promise<void> {
  state.stopped = true;
  if (state.heartbeat) clearInterval(state.heartbeat);
  state.heartbeat = undefined;
  while (state.kicking) await new Promise((r) => setTimeout(r, 10));
  const stopConsuming = state.stopConsuming;
  state.stopConsuming = undefined;
  await stopConsuming?.();
  for (const c of state.running.values()) c.abort();
  while (state.finishing.size > 0) await Promise.allSettled([...state.finishing]);
}

/** A worker as in a new process, recovered nothing yet, not kicked (tests of the start-up hook). */
export function forgetRunnerStateForTest(): void {
  state.stopped = false;
  state.recovery = undefined;
}

export function resumeJobs(): void {
  state.stopped = false;
  state.recovery = undefined;
  kickJobs();
}
