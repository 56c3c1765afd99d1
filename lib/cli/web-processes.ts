/**
 * The production web server on every core: WEB_PROCESSES copies of Next's own server
 * (web-copy.ts: Next's request handling behind the front door of kept answers; default one per
 * core, at most 4) share one port through node:cluster, whose primary (this
 * file) hands each new connection to the next copy in turn. One Node process answers on one core
 * only; with a second copy the API keeps answering while the first is busy (a large list, a JSON
 * body, a garbage collection).
 *
 * Only the first copy runs jobs (unless JOBS_IN_WEB=0 leaves them to `npm run worker`), so jobs
 * still run `JOB_CONCURRENCY` at a time as with one process. A job queued or a cancellation asked
 * for in another copy reaches it through this primary at once (lib/server/jobs/local-bus.ts);
 * without that relay it would wait for the worker's next heartbeat. A copy that stops unasked is
 * started again; Ctrl+C or SIGTERM stops them all, and the primary exits when they have.
 *
 * Usage (from local-stack.ts): `node --conditions=react-server --import tsx lib/cli/web-processes.ts -H 127.0.0.1 -p 3000`.
 */
import cluster, { type Worker } from "node:cluster";
import { availableParallelism } from "node:os";
import path from "node:path";
import { parseConfig } from "@/lib/server/config";
import { isSiblingMessage } from "@/lib/server/jobs/sibling-messages";

/** Copies by default: one per core, at most this many (design choice: SQLite has one writer at a time). */
export const MAX_DEFAULT_WEB_PROCESSES = 4;

/** WEB_PROCESSES, or one per core up to MAX_DEFAULT_WEB_PROCESSES. */
export function webProcessCount(configured: number | null, cores = availableParallelism()): number {
  return configured ?? Math.max(1, Math.min(cores, MAX_DEFAULT_WEB_PROCESSES));
}

/** The environment of copy `index`: its number, and jobs in the first copy only. */
export function copyEnv(index: number, jobsInWeb: boolean): Record<string, string> {
  return { MORPHOKIN_WEB_PROCESS: String(index), JOBS_IN_WEB: jobsInWeb && index === 0 ? "1" : "0" };
}

/**
 * Node flags of each copy. A young generation of up to 64 MB per semi-space (V8's default is
 * 16 MB on 64-bit): under load a copy has 25 or more requests in flight, each alive for tens of
 * milliseconds, and with the default a minor collection ran every 30–60 ms and copied them all,
 * then moved them to the old generation. Measured on the server-load bench's lab (50 clients,
 * 2 copies, no readout, `--trace-gc`): collection time 0.19–0.21 ms per request with the default,
 * 0.14 with 32 MB, 0.12 with 64 MB; 619–636, 647–668 and 667–713 requests/s. The space grows to
 * that size only while a copy allocates that fast.
 */
export const COPY_NODE_FLAGS = ["--max-semi-space-size=64"];

/** A copy that stops unasked more often than this (ms) is not started again: something is wrong. */
const RESTART_AT_MOST_EVERY_MS = 5000;

/**
 * The launcher's arguments split: Node's `--cpu-prof…` flags go to each copy's Node (each writes
 * its own profile, named by its process id), the rest (-H host -p port) to each copy (web-copy.ts).
 */
export function splitArgs(args: readonly string[]): { nodeFlags: string[]; nextArgs: string[] } {
  const isNodeFlag = (a: string) => a === "--cpu-prof" || a.startsWith("--cpu-prof-");
  return { nodeFlags: args.filter(isNodeFlag), nextArgs: args.filter((a) => !isNodeFlag(a)) };
}

function main() {
  const { nodeFlags, nextArgs: args } = splitArgs(process.argv.slice(2)); // -H host -p port, as for `next start`
  const config = parseConfig(process.env);
  const count = webProcessCount(config.webProcesses);
  cluster.setupPrimary({
    exec: path.join(import.meta.dirname, "web-copy.ts"),
    args,
    // TypeScript through tsx, without this launcher's react-server condition (web-copy.ts says why).
    execArgv: [...COPY_NODE_FLAGS, "--import", "tsx", ...nodeFlags],
  });
  /** Set once the server stops: the exit code of the primary when the last copy has gone. */
  let stopping: number | null = null;
  /** Each copy's number and when it started. */
  const started = new Map<Worker, { index: number; at: number }>();
  const copies = () => Object.values(cluster.workers ?? {}).filter((w): w is Worker => !!w);
  const exitWhenAllGone = () => {
    if (copies().length === 0) process.exit(stopping ?? 0);
  };
  const stopAll = (code: number) => {
    stopping = code;
    for (const w of copies()) w.process.kill("SIGTERM");
    exitWhenAllGone();
  };
  const start = (index: number) => {
    const worker = cluster.fork(copyEnv(index, config.jobsInWeb));
    started.set(worker, { index, at: Date.now() });
    worker.on("message", (message: unknown) => {
      if (!isSiblingMessage(message)) return;
      for (const other of copies()) if (other !== worker) other.send(message);
    });
  };
  cluster.on("exit", (worker, code, signal) => {
    const { index, at } = started.get(worker) ?? { index: 0, at: 0 };
    started.delete(worker);
    if (stopping !== null) return exitWhenAllGone();
    const soon = Date.now() - at < RESTART_AT_MOST_EVERY_MS;
    process.stderr.write(
      `web process ${index + 1} of ${count} stopped (${signal ?? `exit code ${code}`})${soon ? "" : "; starting it again"}\n`,
    );
    if (!soon) return start(index);
    process.stderr.write(`it stopped within ${RESTART_AT_MOST_EVERY_MS / 1000} s of its start; stopping the server\n`);
    stopAll(1);
  });
  const stop = () => stopAll(0);
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
  process.stdout.write(`web server: ${count} process${count === 1 ? "" : "es"} (WEB_PROCESSES)\n`);
  for (let i = 0; i < count; i++) start(i);
}

if (cluster.isPrimary && process.argv[1] && path.resolve(process.argv[1]) === import.meta.filename) main();
