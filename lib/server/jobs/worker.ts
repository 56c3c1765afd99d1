/**
 * The in-process worker: takes queued jobs from the `jobs` table and runs them in this process,
 * JOB_CONCURRENCY at a time (default one). It knows no handler itself: the composition root
 * (lib/server/jobs/wiring.ts) hands it the kind → handler map with `giveWorkerJobCode`. The queue wakes
 * it through the local bus, so the queue never imports it.
 *
 * At start-up (instrumentation.ts → lib/server/startup.ts) it recovers what a dead process left:
 * jobs left "running" are re-queued once and failed with a reason the second time. Only one
 * process may run jobs this way on a database: a second would take the first one's running jobs
 * for dead ones.
 */
import { database } from "../services";
import { listenForCancel, listenForQueued } from "./local-bus";
import { recoverInterruptedJobs, type RecoveryReport } from "./recovery";
import { runClaimedJob, type JobCode } from "./run-job";

interface WorkerState {
  code?: JobCode;
  running: Map<string, AbortController>;
  /** The one recovery of this process (start-up hook or first kick, whichever comes first). */
  recovery?: Promise<RecoveryReport>;
  kicking: boolean;
  stopped: boolean;
  finishing: Set<Promise<void>>;
  listening: boolean;
}
const g = globalThis as unknown as { __morphokinJobs?: WorkerState };
const state: WorkerState = (g.__morphokinJobs ??= {
  running: new Map(),
  kicking: false,
  stopped: false,
  finishing: new Set(),
  listening: false,
});
const concurrency = () => Math.max(1, Number(process.env.JOB_CONCURRENCY ?? "1") || 1);

/** Gives this process's worker its handlers (the composition root calls it) and starts listening. */
export function giveWorkerJobCode(code: JobCode): void {
  state.code = code;
  if (state.listening) return;
  state.listening = true;
  listenForQueued(() => kickJobs());
  listenForCancel((jobId) => {
    const controller = state.running.get(jobId);
    controller?.abort();
    return controller !== undefined;
  });
}

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
  return (state.recovery ??= recoverInterruptedJobs(code, [...state.running.keys()]).catch((err: unknown) => {
    state.recovery = undefined;
    throw err;
  }));
}

/** Starts queued jobs while there is capacity. Safe to call often; does nothing without handlers. */
export function kickJobs(): void {
  if (state.kicking || state.stopped || !state.code) return;
  const code = state.code;
  state.kicking = true;
  void (async () => {
    try {
      await recoverOnce();
      const m = await database();
      while (state.running.size < concurrency() && !state.stopped) {
        const next = await m.Job.findOne({ where: { status: "queued" }, order: [["createdAt", "asc"]] });
        if (!next) break;
        const [claimed] = await m.Job.update(
          { status: "running", startedAt: new Date(), progress: 0 },
          { where: { id: next.id, status: "queued" } },
        );
        if (claimed === 0) continue;
        const controller = new AbortController();
        state.running.set(next.id, controller);
        const done: Promise<void> = runClaimedJob(code, next, controller).finally(() => {
          state.running.delete(next.id);
          state.finishing.delete(done);
          kickJobs();
        });
        state.finishing.add(done);
      }
    } catch (err) {
      console.error("job worker:", err);
    } finally {
      state.kicking = false;
    }
  })();
}

/** Cancels running jobs and waits for them to record it; no new job starts until `resumeJobs`. */
export async function stopJobs(): Promise<void> {
  state.stopped = true;
  while (state.kicking) await new Promise((r) => setTimeout(r, 10));
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
