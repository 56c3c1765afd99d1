/**
 * The one way jobs run heavy work off the event loop: a child Node process running one of the
 * entries of this folder (`startChild("readout", args)` runs `lib/workers/readout-child.ts`)
 * under tsx, from the project folder, with the parent's NODE_OPTIONS cleared. Its stderr is
 * split into lines; each line goes to `onLine` first (progress and error lines of the entry's own
 * protocol) and is kept as plain stderr when `onLine` does not take it. The child is killed when
 * `signal` aborts (the promise then rejects with JobCancelledError) or after `timeLimitMs`
 * (resolves with `timedOut: true`); every other end resolves, and the caller reads the exit code.
 * Used by image readouts (server/readouts/process.ts), fits (server/fits/process.ts) and simulations
 * (server/runs/job.ts).
 */
import "server-only";
import { spawn, type ChildProcess } from "node:child_process";
import { getPriority, setPriority } from "node:os";
import path from "node:path";
import { JobCancelledError } from "../server/jobs/types";

/**
 * Node flags of a process that loads lib/server outside Next: TypeScript through tsx, and the
 * react-server condition, under which the `server-only` marker resolves to its empty module.
 */
export const SERVER_NODE_FLAGS = ["--conditions=react-server", "--import", "tsx"];

export interface ChildOutcome {
  code: number | null;
  stdout: string;
  /** stderr lines `onLine` did not take. */
  stderr: string;
  timedOut: boolean;
}

/**
 * Every child entry, by name. The entries are files of this folder (type-checked and linted with
 * the rest); a file path, not an import, because Next bundles the server and a bundled module has
 * no file a child process could run.
 */
const CHILD_ENTRIES = {
  readout: "readout-child.ts",
  fit: "fit-child.ts",
  simulate: "simulate-child.ts",
} as const;

export type ChildName = keyof typeof CHILD_ENTRIES;

/**
 * The niceness of a child (Linux: 0 normal … 19 lowest). A readout, fit or simulation is batch
 * work that takes a second or a minute; the web server's answers take milliseconds and a person
 * waits for each. At the same priority a CPU-bound child took half the CPU from the server and its
 * API answers queued behind it (tests/bench/server-load.bench.ts); at 10 the scheduler gives the
 * server the CPU when it has work and the child everything else (design choice: nice(1)'s default
 * adjustment, from memory).
 */
export const CHILD_NICENESS = 10;

/**
 * Lowers a child's CPU priority to CHILD_NICENESS (never above a server already running nicer);
 * a platform that refuses (some containers, Windows) keeps it as it was.
 */
export function lowerChildPriority(child: Pick<ChildProcess, "pid">): void {
  if (child.pid === undefined) return;
  try {
    setPriority(child.pid, Math.max(CHILD_NICENESS, getPriority()));
  } catch {
    // not permitted here: the child runs at the server's priority, as before
  }
}

/** The file a child runs; the server and workers run from the project folder. */
export function childEntryPath(name: ChildName): string {
  return path.join(process.cwd(), "lib", "workers", CHILD_ENTRIES[name]);
}

export function startChild(
  name: ChildName,
  args: string[],
  options: { signal: AbortSignal; timeLimitMs: number; onLine?: (line: string) => boolean },
): Promise<ChildOutcome> {
  return new Promise((resolve, reject) => {
    if (options.signal.aborted) return reject(new JobCancelledError());
    const child = spawn(process.execPath, [...SERVER_NODE_FLAGS, childEntryPath(name), ...args], {
      cwd: process.cwd(),
      stdio: ["ignore", "pipe", "pipe"],
      env: { ...process.env, NODE_OPTIONS: "" },
    });
    lowerChildPriority(child);
    const out: Buffer[] = [];
    let stderr = "",
      pending = "",
      timedOut = false;
    const kill = () => child.kill("SIGKILL");
    options.signal.addEventListener("abort", kill, { once: true });
    // A process far past its limit (stuck or starved) must not hold the job queue.
    const timer = setTimeout(() => {
      timedOut = true;
      kill();
    }, options.timeLimitMs);
    timer.unref();
    child.stdout.on("data", (b: Buffer) => out.push(b));
    child.stderr.on("data", (b: Buffer) => {
      const lines = (pending + b.toString()).split("\n");
      pending = lines.pop() ?? "";
      for (const line of lines) if (!options.onLine?.(line)) stderr += line + "\n";
    });
    child.on("error", (err) => reject(err));
    child.on("close", (code) => {
      clearTimeout(timer);
      options.signal.removeEventListener("abort", kill);
      if (pending && !options.onLine?.(pending)) stderr += pending;
      if (options.signal.aborted) return reject(new JobCancelledError());
      resolve({ code, stdout: Buffer.concat(out).toString("utf8"), stderr, timedOut });
    });
  });
}

/** Parses `<prefix> {json}` lines of a child's stderr protocol; null for other lines or torn JSON. */
export function parseProtocolLine<T>(line: string, prefix: string): T | null {
  if (!line.startsWith(`${prefix} `)) return null;
  try {
    return JSON.parse(line.slice(prefix.length + 1)) as T;
  } catch {
    return null; // a torn line; the next one will do
  }
}
