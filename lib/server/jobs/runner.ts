/**
 * Background jobs behind one interface: a `jobs` table in SQLite, run in this process, one at a
 * time by default (JOB_CONCURRENCY). The same interface could sit on a queue engine with workers
 * on many machines; callers only enqueue and read job rows.
 */
import "server-only";
import { Op, type Transaction } from "sequelize";
import type { JobStatus } from "@/models/job";
import { AppError, notFound } from "../errors";
import { database, services } from "../services";
import { settleAllDerivedRows, settleDerivedRows } from "./derived-rows";
import { JOB_CLEANUPS, JOB_HANDLERS } from "./registry";
import { JobCancelledError, type JobInput } from "./types";
import "./handlers";

interface RunnerState {
  running: Map<string, AbortController>;
  /** The one recovery of this process (start-up hook or first kick, whichever comes first). */
  recovery?: Promise<RecoveryReport>;
  kicking: boolean;
  stopped: boolean;
  finishing: Set<Promise<void>>;
}
const g = globalThis as unknown as { __morphokinJobs?: RunnerState };
const state: RunnerState = (g.__morphokinJobs ??= {
  running: new Map(),
  kicking: false,
  stopped: false,
  finishing: new Set(),
});
const concurrency = () => services().config.jobConcurrency;

export interface JobDto {
  id: string;
  kind: string;
  status: JobStatus;
  progress: number;
  progressNote: string | null;
  error: string | null;
  result: Record<string, unknown> | null;
  requestedBy: string | null;
  /** How often a server stop interrupted it (it is re-queued once, then failed). */
  restarts: number;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

type JobRow = InstanceType<Awaited<ReturnType<typeof database>>["Job"]>;

export function toJobDto(j: JobRow): JobDto {
  return {
    id: j.id,
    kind: j.kind,
    status: j.status,
    progress: j.progress,
    progressNote: j.progressNote,
    error: j.error,
    result: j.result,
    requestedBy: j.requestedBy,
    restarts: j.restarts,
    createdAt: j.createdAt.toISOString(),
    startedAt: j.startedAt?.toISOString() ?? null,
    finishedAt: j.finishedAt?.toISOString() ?? null,
  };
}

/** Queues a job; it starts after the surrounding transaction (if any) commits. */
export async function enqueueJob(
  input: { labId: string; kind: string; payload: Record<string, unknown>; requestedBy: string | null },
  transaction?: Transaction,
): Promise<JobRow> {
  if (!JOB_HANDLERS[input.kind]) throw new Error(`no handler for job kind "${input.kind}"`);
  const m = await database();
  const job = await m.Job.create({ ...input, status: "queued" }, { transaction });
  if (transaction) transaction.afterCommit(() => kickJobs());
  else kickJobs();
  return job;
}

/** Progress note of a job re-queued because the server stopped while it ran. */
export const RESTARTED_NOTE = "restarted after a server restart";
/** Error of a job that a second server stop interrupted: it is not tried a third time. */
export const INTERRUPTED_TWICE =
  "failed: the server stopped twice while this job ran, so it was not started a third time; start it again, and if it keeps failing, make it smaller";

export interface RecoveryReport {
  requeued: string[];
  failed: string[];
}

/**
 * Jobs left "running" by a process that died (killed, crashed, restarted) are re-queued once and
 * failed with a reason the second time; rows of ended jobs still open are settled; then queued
 * jobs start. Run once per process at start-up (instrumentation.ts → lib/server/startup.ts), and
 * lazily by the first kick in a process without that hook (CLI, tests). Only one process may run
 * jobs on a database: a second would take the first one's running jobs for dead ones.
 */
export async function recoverJobs(): Promise<RecoveryReport> {
  const report = await recoverOnce();
  kickJobs();
  return report;
}

/** The process's one recovery; a failed one (database unreachable) is tried again by the next call. */
function recoverOnce(): Promise<RecoveryReport> {
  return (state.recovery ??= recoverInterruptedJobs().catch((err: unknown) => {
    state.recovery = undefined;
    throw err;
  }));
}

async function recoverInterruptedJobs(): Promise<RecoveryReport> {
  const m = await database();
  const report: RecoveryReport = { requeued: [], failed: [] };
  // Jobs this process runs itself are alive, whatever their row says.
  const stale = await m.Job.findAll({ where: { status: "running", id: { [Op.notIn]: [...state.running.keys()] } } });
  for (const job of stale) {
    if (job.restarts >= 1) {
      const [n] = await m.Job.update(
        { status: "failed", error: INTERRUPTED_TWICE, finishedAt: new Date() },
        { where: { id: job.id, status: "running" } },
      );
      if (n === 0) continue;
      report.failed.push(job.id);
      await settleDerivedRows([{ id: job.id, status: "failed", error: INTERRUPTED_TWICE }]);
      await cleanUpAfterInterruption(job);
    } else {
      const [n] = await m.Job.update(
        { status: "queued", progress: 0, progressNote: RESTARTED_NOTE, startedAt: null, restarts: job.restarts + 1 },
        { where: { id: job.id, status: "running" } },
      );
      if (n > 0) report.requeued.push(job.id);
    }
  }
  await settleAllDerivedRows();
  if (report.requeued.length + report.failed.length > 0)
    console.warn(`jobs: ${report.requeued.length} re-queued and ${report.failed.length} failed after a server stop`);
  return report;
}

/** Removes the objects an interrupted attempt may have left (its own clean-up never ran). */
async function cleanUpAfterInterruption(job: JobRow): Promise<void> {
  const cleanup = JOB_CLEANUPS[job.kind];
  if (!cleanup) return;
  await cleanup({
    id: job.id,
    labId: job.labId,
    kind: job.kind,
    payload: job.payload,
    requestedBy: job.requestedBy,
  }).catch((err) => console.error(`job ${job.kind} ${job.id}: clean-up after a server stop failed`, err));
}

/** Starts queued jobs while there is capacity. Safe to call often. */
export function kickJobs(): void {
  if (state.kicking || state.stopped) return;
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
        const done: Promise<void> = execute(next, controller).finally(() => {
          state.running.delete(next.id);
          state.finishing.delete(done);
          kickJobs();
        });
        state.finishing.add(done);
      }
    } catch (err) {
      console.error("job runner:", err);
    } finally {
      state.kicking = false;
    }
  })();
}

async function execute(row: JobRow, controller: AbortController) {
  const m = await database();
  const handler = JOB_HANDLERS[row.kind];
  const input: JobInput = {
    id: row.id,
    labId: row.labId,
    kind: row.kind,
    payload: row.payload,
    requestedBy: row.requestedBy,
  };
  let last = 0;
  const progress = async (fraction: number, note?: string) => {
    const now = Date.now();
    if (now - last < 250 && fraction < 1) return;
    last = now;
    await m.Job.update(
      { progress: Math.min(1, Math.max(0, fraction)), progressNote: note ?? null },
      { where: { id: row.id } },
    );
  };
  const startedMs = Date.now();
  try {
    // Let the request that queued the job answer first.
    await new Promise((r) => setImmediate(r));
    const result = await handler(input, { progress, signal: controller.signal });
    if (controller.signal.aborted) throw new JobCancelledError();
    await m.Job.update({ status: "succeeded", progress: 1, result, finishedAt: new Date() }, { where: { id: row.id } });
    mailIfLong(input, "succeeded", null, startedMs);
  } catch (err) {
    const cancelled = err instanceof JobCancelledError || controller.signal.aborted;
    const message =
      err instanceof AppError || err instanceof JobCancelledError
        ? err.message
        : err instanceof Error
          ? err.message
          : String(err);
    if (!cancelled && !(err instanceof AppError)) console.error(`job ${row.kind} ${row.id} failed:`, err);
    const status = cancelled ? "cancelled" : "failed";
    await m.Job.update({ status, error: message, finishedAt: new Date() }, { where: { id: row.id } });
    await settleDerivedRows([{ id: row.id, status, error: message }]).catch((e) =>
      console.error(`job ${row.kind} ${row.id}: could not settle its row`, e),
    );
    if (row.restarts > 0) await cleanUpAfterInterruption(row);
    if (!cancelled) mailIfLong(input, "failed", message, startedMs);
  }
}

/**
 * The one mail hook: a job that ran longer than JOB_MAIL_AFTER_S seconds (default 10) e-mails its
 * requester when it finishes or fails, unless they turned e-mail off. A job may name itself and
 * its page in its payload (`title`, `path`). Fire and forget: a mail failure is logged and never
 * changes the job's status, which is already written.
 */
function mailIfLong(job: JobInput, status: "succeeded" | "failed", error: string | null, startedMs: number): void {
  const seconds = (Date.now() - startedMs) / 1000;
  if (!job.requestedBy || !(seconds > services().config.jobMailAfterS)) return;
  void (async () => {
    const m = await database();
    const user = await m.User.findByPk(job.requestedBy!, { attributes: ["email", "notifyByEmail"] });
    if (!user || user.notifyByEmail === false) return;
    const lab = await m.Lab.findByPk(job.labId, { attributes: ["name"] });
    const { appUrl } = services().config;
    const title = typeof job.payload.title === "string" ? job.payload.title : `your ${job.kind} job`;
    const link = `${appUrl}${typeof job.payload.path === "string" ? job.payload.path : `/labs/${job.labId}`}`;
    const verb = status === "succeeded" ? "finished" : "failed";
    await services().mailer.send({
      to: user.email,
      subject: `[${lab?.name ?? "Morphokin"}] ${title.charAt(0).toUpperCase()}${title.slice(1)} ${verb}`,
      text: [
        `${title.charAt(0).toUpperCase()}${title.slice(1)} ${verb} after ${Math.round(seconds)} s.`,
        ...(error ? ["", `Why: ${error}`] : []),
        "",
        `Open it: ${link}`,
        "",
        `Turn these e-mails off under “E-mail notifications” on your account page: ${appUrl}/account`,
      ].join("\n"),
    });
  })().catch((err) => console.error(`job ${job.kind} ${job.id}: the finish e-mail could not be sent`, err));
}

export async function getJob(labId: string, jobId: string): Promise<JobDto> {
  const m = await database();
  const job = await m.Job.findOne({ where: { id: jobId, labId } });
  if (!job) throw notFound("job");
  return toJobDto(job);
}

export async function cancelJob(labId: string, jobId: string): Promise<JobDto> {
  const m = await database();
  const job = await m.Job.findOne({ where: { id: jobId, labId } });
  if (!job) throw notFound("job");
  if (job.status === "queued") {
    await job.update({ status: "cancelled", error: "the job was cancelled", finishedAt: new Date() });
    await settleDerivedRows([{ id: job.id, status: "cancelled", error: "the job was cancelled" }]);
  } else if (job.status === "running") {
    state.running.get(job.id)?.abort();
  } else {
    throw new AppError("conflict", `this job has already ${job.status === "succeeded" ? "finished" : job.status}`);
  }
  return toJobDto((await m.Job.findByPk(job.id))!);
}

/** Waits until a job leaves queued/running (tests and the CLI). */
export async function waitForJob(jobId: string, timeoutMs = 60_000): Promise<JobDto> {
  const m = await database();
  const until = Date.now() + timeoutMs;
  for (;;) {
    const j = await m.Job.findByPk(jobId);
    if (!j) throw notFound("job");
    if (j.status !== "queued" && j.status !== "running") return toJobDto(j);
    if (Date.now() > until) throw new Error(`job ${jobId} still ${j.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** Cancels running jobs and waits for them to record it; no new job starts until `resumeJobs`. */
export async function stopJobs(): Promise<void> {
  state.stopped = true;
  while (state.kicking) await new Promise((r) => setTimeout(r, 10));
  for (const c of state.running.values()) c.abort();
  while (state.finishing.size > 0) await Promise.allSettled([...state.finishing]);
}

/** A runner as in a new process, recovered nothing yet, not kicked (tests of the start-up hook). */
export function forgetRunnerStateForTest(): void {
  state.stopped = false;
  state.recovery = undefined;
}

export function resumeJobs(): void {
  state.stopped = false;
  state.recovery = undefined;
  kickJobs();
}
