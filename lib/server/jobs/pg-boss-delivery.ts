/**
 * Job delivery through pg-boss, a queue engine that lives in the same PostgreSQL database (schema
 * `pgboss`): no extra service to run. pg-boss carries "job X is waiting" to one worker among many
 * processes and machines (SKIP LOCKED), retries a delivery whose worker died before finishing it
 * (after the kind's time limit, up to JOB_RETRY_LIMIT times), and expires attempts past the
 * kind's time limit. The `jobs` table stays the record of each job: a worker runs a delivered job
 * only if it can claim its row from "queued" (lib/server/jobs/worker.ts), so a late or repeated
 * delivery never runs a job twice.
 */
import "server-only";
import PgBoss from "pg-boss";
import type { JobDelivery } from "./delivery";
import { announceCancel } from "./local-bus";
import { JOB_RETRY_LIMIT, JOB_TIME_LIMITS_S, isJobKind } from "./kinds";

/** The one pg-boss queue of Morphokin; the kind travels in the message and sets its limits. */
export const PG_BOSS_QUEUE = "morphokin-jobs";
/** How often an idle consumer asks for work, s (pg-boss's minimum is 0.5). Design choice. */
const POLLING_INTERVAL_S = 0.5;

interface Message {
  jobId: string;
  kind: string;
}

export function createPgBossDelivery(connectionString: string): JobDelivery {
  let started: Promise<PgBoss> | undefined;
  const boss = (): Promise<PgBoss> =>
    (started ??= (async () => {
      const b = new PgBoss({ connectionString, schema: "pgboss", max: 4 });
      b.on("error", (err) => console.error("pg-boss:", err));
      await b.start();
      await b.createQueue(PG_BOSS_QUEUE, { name: PG_BOSS_QUEUE, retryLimit: JOB_RETRY_LIMIT });
      return b;
    })().catch((err: unknown) => {
      started = undefined;
      throw err;
    }));

  return {
    name: "pg-boss",
    async deliver(job) {
      // A little beyond the worker's own limit, so the worker reports the time limit itself.
      const limitS = (isJobKind(job.kind) ? JOB_TIME_LIMITS_S[job.kind] : 3600) + 60;
      const message: Message = { jobId: job.id, kind: job.kind };
      await (await boss()).send(PG_BOSS_QUEUE, message, { retryLimit: JOB_RETRY_LIMIT, expireInSeconds: limitS });
    },
    async cancelRunning(jobId) {
      announceCancel(jobId);
    },
    async consume(concurrency, take) {
      const b = await boss();
      for (let i = 0; i < concurrency; i++)
        await b.work<Message>(
          PG_BOSS_QUEUE,
          { batchSize: 1, pollingIntervalSeconds: POLLING_INTERVAL_S },
          async ([job]) => take(job.data.jobId),
        );
      return async () => {
        await b.offWork(PG_BOSS_QUEUE);
      };
    },
    async close() {
      if (!started) return;
      const b = await started.catch(() => null);
      started = undefined;
      await b?.stop({ graceful: false, wait: true, close: true });
    },
  };
}
