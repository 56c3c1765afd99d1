/**
 * A real, isolated back end for API tests: SQLite in a temp folder, the fake S3 server and the
 * fake SMTP server on free ports, wired in through the composition root.
 */
import { spawn } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { startFakeS3 } from "@/fake-services/fake-s3";
import { startFakeSmtp } from "@/fake-services/fake-smtp";
import { readConfig } from "@/lib/server/config";
import { createServices, setServicesForTest, type Services } from "@/lib/server/services";
import { stopJobs } from "@/lib/server/jobs/worker";
import { startJobs } from "@/lib/server/jobs/wiring";
import { fakeServicesArgs, ROOT } from "@/lib/cli/local-stack";
import { freePort } from "./free-port";
import { createTestDatabase } from "./postgres";

export { freePort };

/**
 * A port where nothing listens, for "service is down" tests. Port 1 (tcpmux) is privileged and
 * unused on these machines; a free port from `freePort()` could be taken by a parallel test.
 */
export const DEAD_PORT = 1;

export interface TestStack {
  services: Services;
  dir: string;
  mailboxUrl: string;
  close(): Promise<void>;
}

/**
 * The environment of a process a test starts on this stack (a worker, a second server, an upload
 * client): the stack's database, data folder, object store and mail server. A child given less
 * falls back to the configured defaults, i.e. the developer's own storage/data/morphokin.sqlite.
 */
export function stackChildEnv(stack: TestStack): NodeJS.ProcessEnv {
  const c = stack.services.config;
  return {
    ...process.env,
    NODE_OPTIONS: "",
    MORPHOKIN_DATA_DIR: c.dataDir,
    DATABASE_PATH: c.databasePath,
    DATABASE_URL: c.databaseUrl,
    S3_ENDPOINT: c.s3.endpoint,
    S3_BUCKET: c.s3.bucket,
    SMTP_URL: c.smtp.url,
  };
}

function isPortTaken(err: unknown): boolean {
  return (err as NodeJS.ErrnoException)?.code === "EADDRINUSE";
}

/**
 * `start` on three free ports (object store, SMTP, mailbox over HTTP). A port `freePort()` found free
 * can be taken by a parallel test before the fake listens on it; then `start` runs again on new ports.
 */
async function onFreePorts<T>(
  start: (ports: { s3Port: number; smtpPort: number; httpPort: number }) => Promise<T>,
  attempts = 5,
): Promise<T & { s3Port: number; smtpPort: number; httpPort: number }> {
  for (let attempt = 1; ; attempt++) {
    const ports = { s3Port: await freePort(), smtpPort: await freePort(), httpPort: await freePort() };
    try {
      return { ...(await start(ports)), ...ports };
    } catch (err) {
      if (!isPortTaken(err) || attempt >= attempts) throw err;
    }
  }
}

/** The fake object store and mail server in this process. */
const startFakes = (dir: string) =>
  onFreePorts(async ({ s3Port, smtpPort, httpPort }) => {
    const s3 = await startFakeS3({ port: s3Port, directory: path.join(dir, "s3"), bucket: "morphokin-test" });
    try {
      const smtp = await startFakeSmtp({ smtpPort, httpPort, directory: path.join(dir, "mail") });
      return { s3, smtp };
    } catch (err) {
      await s3.close().catch(() => undefined);
      throw err;
    }
  });

/**
 * The same fakes, run by fake-services/run.ts in a process of their own (as `npm start` runs them),
 * for a measurement whose clients share this process: the fake object store hashing and streaming a
 * 32 MB image would otherwise hold the clients' event loop, and time its work as theirs.
 */
const startFakesInChild = (dir: string) =>
  onFreePorts(async ({ s3Port, smtpPort, httpPort }) => {
    const child = spawn(process.execPath, fakeServicesArgs(), {
      cwd: ROOT,
      stdio: ["ignore", "pipe", "pipe"],
      env: {
        ...process.env,
        NODE_OPTIONS: "",
        MORPHOKIN_DATA_DIR: dir,
        S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
        S3_BUCKET: "morphokin-test",
        SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
        DEV_MAILBOX_URL: `http://127.0.0.1:${httpPort}`,
      },
    });
    let output = "";
    const exited = new Promise<void>((resolve) => child.on("exit", () => resolve()));
    const ready = await new Promise<boolean>((resolve) => {
      const seen = (chunk: Buffer) => {
        output += chunk.toString();
        if (output.includes("fake services ready")) resolve(true);
      };
      child.stdout.on("data", seen);
      child.stderr.on("data", seen);
      void exited.then(() => resolve(false));
    });
    if (!ready)
      throw Object.assign(new Error(`the fake services did not start: ${output.trim().slice(-500)}`), {
        code: output.includes("EADDRINUSE") ? "EADDRINUSE" : undefined,
      });
    const close = async () => {
      if (child.exitCode === null) child.kill("SIGTERM");
      await exited;
    };
    return { s3: { close }, smtp: { close } };
  });

export interface TestStackOptions {
  /** "sqlite" forces the SQLite file even in the postgres project (e.g. as a copy's source). */
  database?: "sqlite";
  /** "child-process": the fakes in a process of their own (startFakesInChild); else in this one. */
  fakes?: "in-process" | "child-process";
}

export async function startTestStack(options: TestStackOptions = {}): Promise<TestStack> {
  const dir = mkdtempSync(path.join(tmpdir(), "morphokin-test-"));
  const { s3, smtp, s3Port, smtpPort, httpPort } =
    options.fakes === "child-process" ? await startFakesInChild(dir) : await startFakes(dir);
  // MORPHOKIN_TEST_DB=postgres: a database of its own on the run's test server (tests/support/postgres.ts).
  const onPostgres = process.env.MORPHOKIN_TEST_DB === "postgres" && options.database !== "sqlite";
  const pgDatabase = onPostgres ? await createTestDatabase() : null;
  const base = readConfig();
  const config = {
    ...base,
    dataDir: dir,
    databasePath: path.join(dir, "test.sqlite"),
    databaseUrl: pgDatabase?.url ?? "",
    appUrl: "http://127.0.0.1:3999",
    s3: { ...base.s3, endpoint: `http://127.0.0.1:${s3Port}`, bucket: "morphokin-test" },
    smtp: { ...base.smtp, url: `smtp://127.0.0.1:${smtpPort}` },
    devMailboxUrl: `http://127.0.0.1:${httpPort}`,
    maxUploadBytes: 2 * 1024 * 1024,
  };
  const services = createServices(config);
  await services.db.ready;
  setServicesForTest(services);
  startJobs();
  return {
    services,
    dir,
    mailboxUrl: config.devMailboxUrl,
    async close() {
      await stopJobs();
      await services.jobs.close();
      setServicesForTest(undefined);
      await services.db.sequelize.close();
      await pgDatabase?.drop();
      await Promise.allSettled([s3.close(), smtp.close()]);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
