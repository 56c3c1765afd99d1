/**
 * `npm run worker`: a process that runs readouts, fits and verification runs, on this machine or
 * any other that reaches the same database and object storage (same environment variables as the
 * web server). WORKER_CONCURRENCY jobs at once (default 1). With DATABASE_URL on PostgreSQL the
 * jobs come through pg-boss; on the SQLite file, from the `jobs` table of that file.
 * SIGTERM / SIGINT: the worker's row is removed so its running jobs are taken up at once by
 * another worker (or failed after their retries), and the process exits.
 */
import { readConfig } from "@/lib/server/config";
import { services } from "@/lib/server/services";
import { startWorkerProcess } from "@/lib/server/jobs/wiring";
import { workerId } from "@/lib/server/jobs/worker";
import { removeWorker } from "@/lib/server/jobs/worker-registry";

async function main() {
  const config = readConfig();
  await services().db.ready;
  await startWorkerProcess(config.workerConcurrency);
  process.stdout.write(
    `worker ${workerId()}: ${services().jobs.name} queue, ${config.workerConcurrency} job(s) at once\n`,
  );
  const stop = async () => {
    const id = workerId();
    if (id) await removeWorker(id).catch(() => undefined);
    process.exit(0);
  };
  // The worker's own timers do not hold a process open (they also run inside the web server);
  // this one keeps the worker alive until it is stopped.
  setInterval(() => undefined, 3_600_000);
  process.once("SIGTERM", () => void stop());
  process.once("SIGINT", () => void stop());
}

main().catch((err: unknown) => {
  process.stderr.write(`the worker could not start: ${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
