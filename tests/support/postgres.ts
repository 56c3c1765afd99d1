/**
 * A real PostgreSQL server for tests: Debian's PostgreSQL (`/usr/lib/postgresql/<version>/bin`),
 * `initdb` into a temporary folder, run as an unprivileged user (the `postgres` system user via
 * `runuser` when we are root, as in CI; PostgreSQL refuses to run as root), listening on a free
 * port on 127.0.0.1 only, stopped and removed at the end.
 *
 * Use:
 * - as a vitest globalSetup (default export; the "postgres" project in vitest.config.mts): starts one
 *   server for the run and passes its admin URL to the test processes in MORPHOKIN_TEST_PG_URL (a
 *   URL already set there, e.g. an outside server, is used as it is and nothing is started);
 * - `createTestDatabase()`: one fresh database per test stack (`CREATE DATABASE`), so test files
 *   stay independent; `drop()` removes it;
 * - `startPostgres()` directly, from a script or a test that needs its own server.
 */
import { execFileSync, spawn, spawnSync } from "node:child_process";
import { chownSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import { freePort } from "./free-port";

/** The environment variable that carries the admin URL of the test server to test processes. */
export const TEST_PG_URL_ENV = "MORPHOKIN_TEST_PG_URL";
/** A database migrated once by the global setup; each stack's database is a copy of it. */
const TEMPLATE_DB = "morphokin_template";
const TEMPLATE_ENV = "MORPHOKIN_TEST_PG_TEMPLATE";
/** The superuser initdb creates; trust authentication, reachable from 127.0.0.1 only. */
const SUPERUSER = "morphokin";
const START_DEADLINE_MS = 30_000;

export interface PostgresServer {
  /** URL of the server's `postgres` database as the superuser (for CREATE/DROP DATABASE). */
  adminUrl: string;
  stop(): Promise<void>;
}

/** The newest Debian PostgreSQL bin folder, or a message saying how to install one. */
export function findPostgresBin(): string {
  const root = "/usr/lib/postgresql";
  const versions = existsSync(root)
    ? readdirSync(root)
        .filter((v) => existsSync(path.join(root, v, "bin", "initdb")))
        .sort((a, b) => Number(b) - Number(a))
    : [];
  if (versions.length === 0) {
    throw new Error(
      "PostgreSQL is not installed (no /usr/lib/postgresql/<version>/bin/initdb); run: apt-get install -y postgresql",
    );
  }
  return path.join(root, versions[0], "bin");
}

/** The account the server runs as: ourselves, or (as root) the `postgres` system user. */
function serverUser(): { name: string; uid: number; gid: number } | null {
  if (process.getuid?.() !== 0) return null;
  const id = (flag: string) => Number(execFileSync("id", [flag, "postgres"], { encoding: "utf8" }).trim());
  if (spawnSync("id", ["postgres"]).status !== 0) {
    // Debian's package creates it; a bare image may not have it.
    execFileSync("useradd", ["--system", "--no-create-home", "--shell", "/usr/sbin/nologin", "postgres"]);
  }
  return { name: "postgres", uid: id("-u"), gid: id("-g") };
}

function runAs(user: ReturnType<typeof serverUser>, bin: string, args: string[]): void {
  const [cmd, argv] = user ? ["runuser", ["-u", user.name, "--", bin, ...args]] : [bin, args];
  const res = spawnSync(cmd, argv, { encoding: "utf8" });
  if (res.status !== 0) {
    throw new Error(`${path.basename(bin)} failed (${res.status}): ${res.stderr || res.stdout || res.error}`);
  }
}

/** Polls until the server accepts a query, or throws with its log after the deadline. */
async function waitUntilReady(adminUrl: string, logFile: string): Promise<void> {
  const deadline = Date.now() + START_DEADLINE_MS;
  for (;;) {
    const client = new pg.Client({ connectionString: adminUrl });
    try {
      await client.connect();
      await client.query("SELECT 1");
      return;
    } catch (err) {
      if (Date.now() > deadline) {
        const log = existsSync(logFile) ? readFileSync(logFile, "utf8") : "(no log)";
        throw new Error(`PostgreSQL did not start within ${START_DEADLINE_MS} ms: ${String(err)}\n${log}`);
      }
      await new Promise((r) => setTimeout(r, 100));
    } finally {
      await client.end().catch(() => {});
    }
  }
}

/**
 * A detached shell that stops the server and removes its folder once `pid` is gone, so a test run
 * killed before its teardown (Ctrl-C twice, a CI timeout) leaves no server behind. It checks every
 * 2 s; a normal stop kills it first.
 */
function stopWhenGone(pid: number, user: ReturnType<typeof serverUser>, bin: string, dataDir: string, dir: string) {
  const pgCtl = [...(user ? ["runuser", "-u", user.name, "--"] : []), path.join(bin, "pg_ctl")].join(" ");
  const script = `while kill -0 ${pid} 2>/dev/null; do sleep 2; done; ${pgCtl} stop -D '${dataDir}' -m immediate -s; rm -rf '${dir}'`;
  const child = spawn("sh", ["-c", script], { detached: true, stdio: "ignore" });
  child.unref();
  return child;
}

/** initdb into a temp folder and start the server on a free 127.0.0.1 port. */
export async function startPostgres(): Promise<PostgresServer> {
  const bin = findPostgresBin();
  const user = serverUser();
  const dir = mkdtempSync(path.join(tmpdir(), "morphokin-pg-"));
  if (user) chownSync(dir, user.uid, user.gid);
  const dataDir = path.join(dir, "data");
  const logFile = path.join(dir, "server.log");
  runAs(user, path.join(bin, "initdb"), [
    "-D",
    dataDir,
    "-U",
    SUPERUSER,
    "--auth=trust",
    "--encoding=UTF8",
    "--locale=C",
    "--no-sync",
  ]);
  const port = await freePort();
  // Durability off: a test server's data is thrown away, and fsync on 2 shared cores is the slow part.
  const serverOptions = [
    `-p ${port}`,
    "-c listen_addresses=127.0.0.1",
    `-c unix_socket_directories=${dir}`,
    "-c fsync=off",
    "-c synchronous_commit=off",
    "-c full_page_writes=off",
    "-c max_connections=300",
  ].join(" ");
  runAs(user, path.join(bin, "pg_ctl"), ["start", "-D", dataDir, "-l", logFile, "-o", serverOptions, "-s"]);
  const adminUrl = `postgres://${SUPERUSER}@127.0.0.1:${port}/postgres`;
  const watchdog = stopWhenGone(process.pid, user, bin, dataDir, dir);
  const stop = async () => {
    watchdog.kill();
    try {
      runAs(user, path.join(bin, "pg_ctl"), ["stop", "-D", dataDir, "-m", "immediate", "-s"]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  };
  try {
    await waitUntilReady(adminUrl, logFile);
  } catch (err) {
    await stop().catch(() => {});
    throw err;
  }
  return { adminUrl, stop };
}

let counter = 0;

/**
 * A new empty database on the test server (MORPHOKIN_TEST_PG_URL unless `adminUrl` is given),
 * with a name unique to this process; `drop()` removes it, closing what is still connected.
 */
export async function createTestDatabase(adminUrl = process.env[TEST_PG_URL_ENV], options: { empty?: boolean } = {}) {
  if (!adminUrl) throw new Error(`${TEST_PG_URL_ENV} is not set: run the tests with MORPHOKIN_TEST_DB=postgres`);
  const name = `morphokin_test_${process.pid}_${++counter}_${Math.random().toString(36).slice(2, 8)}`;
  const admin = async (sql: string) => {
    const client = new pg.Client({ connectionString: adminUrl });
    await client.connect();
    try {
      await client.query(sql);
    } finally {
      await client.end();
    }
  };
  // A copy of the migrated template (when the global setup made one) skips running every
  // migration again per test file; `empty` asks for a database without tables.
  const template = !options.empty && process.env[TEMPLATE_ENV];
  await admin(`CREATE DATABASE "${name}"${template ? ` TEMPLATE "${template}"` : ""}`);
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return {
    name,
    url: url.toString(),
    drop: () => admin(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`),
  };
}

/** Creates the template database and applies every migration to it (then nothing stays connected). */
async function migrateTemplate(adminUrl: string): Promise<void> {
  const { createDatabase } = await import("@/lib/server/db");
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`CREATE DATABASE "${TEMPLATE_DB}"`);
  } finally {
    await client.end();
  }
  const url = new URL(adminUrl);
  url.pathname = `/${TEMPLATE_DB}`;
  const db = createDatabase(url.toString());
  try {
    await db.ready;
  } finally {
    await db.sequelize.close();
  }
}

/** vitest globalSetup: one server for the whole run. */
export default async function setup(): Promise<(() => Promise<void>) | undefined> {
  if (process.env[TEST_PG_URL_ENV]) return undefined;
  const server = await startPostgres();
  try {
    await migrateTemplate(server.adminUrl);
  } catch (err) {
    await server.stop();
    throw err;
  }
  // Test processes are forked after global setup and inherit this environment.
  process.env[TEST_PG_URL_ENV] = server.adminUrl;
  process.env[TEMPLATE_ENV] = TEMPLATE_DB;
  return async () => {
    delete process.env[TEST_PG_URL_ENV];
    delete process.env[TEMPLATE_ENV];
    await server.stop();
  };
}
