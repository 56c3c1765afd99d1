/** A real `next start` (in WEB_PROCESSES copies, as `npm start` runs it) of this checkout for the benches that measure the server over HTTP (needs `npx next build`). */
import { spawn } from "node:child_process";
import path from "node:path";
import { webProcessesArgs } from "@/lib/cli/local-stack";
import { freePort, type TestStack } from "../support/stack";

const ROOT = path.resolve(import.meta.dirname, "../..");

/**
 * A `next start` of this checkout against the stack's database and fakes; resolves with its base
 * URL. `env` adds or overrides variables of the server (e.g. a larger MAX_UPLOAD_BYTES).
 */
export async function startServer(stack: TestStack, env: Record<string, string> = {}) {
  const port = await freePort();
  const c = stack.services.config;
  // As `npm start` serves: Next's server in WEB_PROCESSES copies on one port (lib/cli/web-processes.ts).
  const child = spawn(
    process.execPath,
    // BENCH_SERVER_CPU_PROF=1: each web process writes its V8 CPU profile to .next-profiles/ when it stops.
    // (Node's own flag, not `next start --experimental-cpu-prof`: that names its file by the second, so
    // the copies, stopped together, overwrote each other's.)
    webProcessesArgs(
      String(port),
      process.env.BENCH_SERVER_CPU_PROF ? ["--cpu-prof", `--cpu-prof-dir=${path.join(ROOT, ".next-profiles")}`] : [],
    ),
    {
      cwd: ROOT,
      stdio: ["ignore", "ignore", "inherit"],
      env: {
        ...process.env,
        NODE_ENV: "production",
        NEXT_TELEMETRY_DISABLED: "1",
        NEXTAUTH_URL: `http://127.0.0.1:${port}`,
        NEXTAUTH_SECRET: "bench-secret-bench-secret-bench-secret",
        MORPHOKIN_DATA_DIR: c.dataDir,
        DATABASE_PATH: c.databasePath,
        DATABASE_URL: c.databaseUrl,
        S3_ENDPOINT: c.s3.endpoint,
        S3_BUCKET: c.s3.bucket,
        SMTP_URL: c.smtp.url,
        DEV_MAILBOX_URL: c.devMailboxUrl,
        MAX_UPLOAD_BYTES: String(c.maxUploadBytes),
        JOB_CONCURRENCY: "1",
        NODE_OPTIONS: "",
        ...env,
      },
    },
  );
  const url = `http://127.0.0.1:${port}`;
  const until = Date.now() + 60_000;
  for (;;) {
    const ok = await fetch(`${url}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) break;
    if (Date.now() > until) throw new Error("next start did not answer /api/health within 60 s");
    await new Promise((r) => setTimeout(r, 250));
  }
  return { url, stop: () => child.kill("SIGTERM") };
}
