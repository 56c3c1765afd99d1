/**
 * Runs one claimed job to its end and records it: the handler of its kind with throttled
 * progress and a cancellation signal, then "succeeded" with the result, or "failed"/"cancelled"
 * with the reason, its derived row settled and, for a job an earlier stop interrupted, the
 * objects of the killed attempt removed. The same for every worker (in the web process, in a
 * worker process, fed by the local queue or by pg-boss).
 */
import "server-only";
import { AppError } from "../errors";
import { database } from "../services";
import { settleDerivedRows } from "./derived-rows";
import { mailIfLong } from "./finish-mail";
import { JOB_TIME_LIMITS_S, isJobKind } from "./kinds";
import type { JobRow } from "./queue";
import { JobCancelledError, type JobCleanup, type JobHandler, type JobInput } from "./types";

export interface JobCode {
  handlers: Record<string, JobHandler>;
  cleanups: Partial<Record<string, JobCleanup>>;
  /** Longest one attempt of each kind may run, s (JOB_TIME_LIMITS_S). */
  timeLimitsS: Partial<Record<string, number>>;
}

export const inputOf = (row: JobRow): JobInput => ({
  id: row.id,
  labId: row.labId,
  kind: row.kind,
  payload: row.payload,
  requestedBy: row.requestedBy,
});

/** Removes the objects an interrupted attempt may have left (its own clean-up never ran). */
export async function cleanUpAfterInterruption(code: JobCode, row: JobRow): Promise<void> {
  const cleanup = code.cleanups[row.kind];
  if (!cleanup) return;
  await cleanup(inputOf(row)).catch((err) =>
    console.error(`job ${row.kind} ${row.id}: clean-up after a stop failed`, err),
  );
}

/** Error of a job stopped by its kind's time limit (JOB_TIME_LIMITS_S). */
export const timeLimitMessage = (kind: string, limitS: number) =>
  `the ${kind} job ran longer than its limit of ${limitS >= 120 ? `${Math.round(limitS / 60)} minutes` : `${limitS} s`} and was stopped; make it smaller or start it again when the server is less busy`;

export async function runClaimedJob(code: JobCode, row: JobRow, controller: AbortController): Promise<void> {
  const m = await database();
  const handler = code.handlers[row.kind];
  const input = inputOf(row);
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
  const limitS = code.timeLimitsS[row.kind] ?? (isJobKind(row.kind) ? JOB_TIME_LIMITS_S[row.kind] : 3600);
  let timedOut = false;
  const timer = setTimeout(() => {
    timedOut = !controller.signal.aborted; // a cancellation that came first stays a cancellation
    controller.abort();
  }, limitS * 1000);
  timer.unref();
  const startedMs = Date.now();
  try {
    // Let the request that queued the job answer first.
    await new Promise((r) => setImmediate(r));
    if (!handler) throw new Error(`no handler for job kind "${row.kind}" in this worker`);
    const result = await handler(input, { progress, signal: controller.signal });
    if (controller.signal.aborted) throw new JobCancelledError();
    await m.Job.update({ status: "succeeded", progress: 1, result, finishedAt: new Date() }, { where: { id: row.id } });
    mailIfLong(input, "succeeded", null, startedMs);
  } catch (err) {
    const cancelled = !timedOut && (err instanceof JobCancelledError || controller.signal.aborted);
    const message = timedOut
      ? timeLimitMessage(row.kind, limitS)
      : err instanceof AppError || err instanceof JobCancelledError
        ? err.message
        : err instanceof Error
          ? err.message
          : String(err);
    if (!cancelled && !timedOut && !(err instanceof AppError)) console.error(`job ${row.kind} ${row.id} failed:`, err);
    const status = cancelled ? "cancelled" : "failed";
    await m.Job.update({ status, error: message, finishedAt: new Date() }, { where: { id: row.id } });
    await settleDerivedRows([{ id: row.id, status, error: message }], { overCancelled: timedOut }).catch((e) =>
      console.error(`job ${row.kind} ${row.id}: could not settle its row`, e),
    );
    if (row.restarts > 0) await cleanUpAfterInterruption(code, row);
    if (!cancelled) mailIfLong(input, "failed", message, startedMs);
  } finally {
    clearTimeout(timer);
  }
}
