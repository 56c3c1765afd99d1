/**
 * A second server process for the kill test (tests/api/jobs-recovery.test.ts): opens the same
 * database (a SQLite file or a postgres:// URL), queues a slow echo job, prints its id on stdout
 * and runs it until it is killed.
 * `node --conditions=react-server --import tsx tests/support/job-child.ts --db FILE_OR_URL --lab LAB_ID --ms MS`
 */
import { readConfig } from "@/lib/server/config";
import { isPostgresUrl } from "@/lib/server/db";
import { createServices, setServicesForTest } from "@/lib/server/services";
import { enqueueJob } from "@/lib/server/jobs/queue";
import { startJobs } from "@/lib/server/jobs/wiring";

function arg(name: string): string {
  const i = process.argv.indexOf(name);
  if (i < 0 || !process.argv[i + 1]) throw new Error(`${name} is required`);
  return process.argv[i + 1];
}

async function main() {
  const db = arg("--db");
  const services = createServices({
    ...readConfig(),
    ...(isPostgresUrl(db) ? { databaseUrl: db } : { databasePath: db, databaseUrl: "" }),
  });
  await services.db.ready;
  setServicesForTest(services);
  startJobs();
  const job = await enqueueJob({
    labId: arg("--lab"),
    kind: "echo",
    payload: { ms: Number(arg("--ms")), value: "from the killed process" },
    requestedBy: null,
  });
  process.stdout.write(`${job.id}\n`);
  // Stay alive; the test kills this process while the job runs.
  setInterval(() => undefined, 60_000);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
