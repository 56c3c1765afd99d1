/**
 * The local stack used by `npm start`, `npm run dev` and the browser tests: fake services as a
 * child process, a persistent session secret, migrations, demo data, then Next itself.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, statSync, writeFileSync, readdirSync } from "node:fs";
import net from "node:net";
import path from "node:path";
import { parseConfig, readConfig } from "@/lib/server/config";

export const ROOT = path.resolve(import.meta.dirname, "../..");

export function ensureSecret(dataDir: string): string {
  if (process.env.NEXTAUTH_SECRET) return process.env.NEXTAUTH_SECRET;
  mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, ".nextauth-secret");
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  return readFileSync(file, "utf8").trim();
}

function portOpen(port: number, host = "127.0.0.1"): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.connect({ port, host });
    s.once("connect", () => {
      s.destroy();
      resolve(true);
    });
    s.once("error", () => resolve(false));
  });
}

export async function waitForPort(port: number, what: string, ms = 30_000) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (await portOpen(port)) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${what} did not start listening on 127.0.0.1:${port} within ${ms / 1000} s`);
}

const portOf = (url: string) => Number(new URL(url).port);

/** Node's arguments for fake-services/run.ts: the fakes in a process of their own. */
export const fakeServicesArgs = () => ["--import", "tsx", path.join(ROOT, "fake-services/run.ts")];

/** Starts the fakes unless something already listens on their ports. */
export async function startFakes(env: NodeJS.ProcessEnv): Promise<ChildProcess | null> {
  const config = readConfig();
  const s3Port = portOf(config.s3.endpoint);
  if (await portOpen(s3Port)) {
    process.stdout.write(`fake services: already running on port ${s3Port}, reusing them\n`);
    return null;
  }
  const child = spawn(process.execPath, fakeServicesArgs(), {
    cwd: ROOT,
    env,
    stdio: ["ignore", "inherit", "inherit"],
  });
  await waitForPort(s3Port, "fake object storage");
  await waitForPort(portOf(config.smtp.url), "fake mail server");
  return child;
}

/** What counts as source for the build: these folders and root files, by extension. */
const SOURCE_DIRS = ["app", "components", "lib", "models", "storage", "migrations"];
const SOURCE_ROOT_FILES = [
  "package.json",
  "package-lock.json",
  "next.config.ts",
  "tsconfig.json",
  "postcss.config.mjs",
];
const SOURCE_EXTENSIONS = /\.(ts|tsx|js|mjs|cjs|css|json|svg|png|woff2?)$/;
/** Run-time data that lives beside the sources (the data folders, the fakes' files): never source. */
const DATA_DIRS = [/^storage\/data/, /^storage\/objects$/, /^storage\/mail$/];

function newestSourceMtime(root: string, rel: string): number {
  let newest = 0;
  for (const entry of readdirSync(path.join(root, rel), { withFileTypes: true })) {
    if (entry.name === "node_modules" || entry.name.startsWith(".")) continue;
    const child = rel ? `${rel}/${entry.name}` : entry.name;
    if (entry.isDirectory()) {
      if (!DATA_DIRS.some((d) => d.test(child))) newest = Math.max(newest, newestSourceMtime(root, child));
    } else if (SOURCE_EXTENSIONS.test(entry.name)) {
      newest = Math.max(newest, statSync(path.join(root, child)).mtimeMs);
    }
  }
  return newest;
}

/**
 * True when there is no production build or a source file is newer than it. Only source files
 * count: the SQLite file and stored objects under storage/ change with every use of the app and
 * must not make `npm start` rebuild.
 */
export function buildIsStale(root = ROOT): boolean {
  const buildId = path.join(root, ".next/BUILD_ID");
  if (!existsSync(buildId)) return true;
  const built = statSync(buildId).mtimeMs;
  const dirs = SOURCE_DIRS.filter((d) => existsSync(path.join(root, d)));
  const files = SOURCE_ROOT_FILES.map((f) => path.join(root, f)).filter(existsSync);
  return dirs.some((d) => newestSourceMtime(root, d) > built) || files.some((f) => statSync(f).mtimeMs > built);
}

export function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { cwd: ROOT, env, stdio: "inherit" });
    child.once("exit", (code) =>
      code === 0 ? resolve() : reject(new Error(`${cmd} ${args.join(" ")} exited with ${code}`)),
    );
  });
}

export function nextBin(): string {
  return path.join(ROOT, "node_modules/next/dist/bin/next");
}

/**
 * Node's arguments for the production server as `npm start` runs it: lib/cli/web-processes.ts
 * (TypeScript, with the react-server condition of the other lib/cli entries) on 127.0.0.1:`port`;
 * `extra` goes on to each `next start`, except Node's `--cpu-prof…` flags, which go to each copy's Node.
 */
export function webProcessesArgs(port: string, extra: string[] = []): string[] {
  return [
    "--conditions=react-server",
    "--import",
    "tsx",
    path.join(ROOT, "lib/cli/web-processes.ts"),
    "-H",
    "127.0.0.1",
    "-p",
    port,
    ...extra,
  ];
}

export function appEnv(): NodeJS.ProcessEnv {
  // Parsed, not read once: dev.ts and start.ts change process.env after this for the seed.
  const config = parseConfig(process.env);
  const port = process.env.PORT ?? "3000";
  return {
    ...process.env,
    NEXT_TELEMETRY_DISABLED: "1",
    NEXTAUTH_URL: process.env.NEXTAUTH_URL ?? `http://127.0.0.1:${port}`,
    NEXTAUTH_SECRET: ensureSecret(config.dataDir),
    DEV_MAILBOX_URL: process.env.DEV_MAILBOX_URL ?? "http://127.0.0.1:2526",
    // The local demo serves the development mailbox with its production build (the app still
    // turns it off unless the app's and the mail catcher's URLs are on loopback).
    MORPHOKIN_DEV_MAILBOX: process.env.MORPHOKIN_DEV_MAILBOX ?? "1",
    PORT: port,
  };
}

/**
 * Runs `next start` or `next dev` in the foreground with the fakes beside it; Ctrl+C or SIGTERM
 * stops both, and the process exits with Next's exit code.
 */
export function serveNext(mode: "start" | "dev", env: NodeJS.ProcessEnv, fakes: ChildProcess | null): ChildProcess {
  const port = env.PORT ?? "3000";
  // Production: Next's server on every core (web-processes.ts); development: one `next dev`.
  const args = mode === "start" ? webProcessesArgs(port) : [nextBin(), mode, "-H", "127.0.0.1", "-p", port];
  const app = spawn(process.execPath, args, {
    cwd: ROOT,
    env,
    stdio: "inherit",
  });
  const stop = () => {
    app.kill("SIGTERM");
    fakes?.kill("SIGTERM");
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
  app.once("exit", (code) => {
    fakes?.kill("SIGTERM");
    process.exit(code ?? 0);
  });
  return app;
}
