/**
 * A job killed with its process leaves its temporary folder (the readout, fit or run child's
 * input and output files) behind; its own `finally` never ran. At start-up, folders of these
 * prefixes older than STALE_AFTER_MS are removed. The age keeps folders of other live processes
 * on the same machine (a second checkout, a test run) safe: none of their jobs runs that long
 * (the longest, a simulation, is killed at 10 × its estimate + 2 min, and its work is capped at
 * RUN_WORK_LIMIT, a few minutes of solver time; see simulation-job.ts and simulation-run-plan.ts).
 */
import "server-only";
import { readdirSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";

const PREFIXES = ["morphokin-readout-", "morphokin-fit-", "morphokin-run-"];
/** Design choice: a day. */
export const STALE_AFTER_MS = 24 * 3_600_000;

/** Removes stale job folders; returns how many. Never throws (a folder in use elsewhere is skipped). */
export async function removeStaleJobFolders(now = Date.now(), dir = tmpdir()): Promise<number> {
  let removed = 0;
  let names: string[] = [];
  try {
    names = readdirSync(dir).filter((n) => PREFIXES.some((p) => n.startsWith(p)));
  } catch {
    return 0;
  }
  for (const name of names) {
    const full = path.join(dir, name);
    try {
      if (now - statSync(full).mtimeMs < STALE_AFTER_MS) continue;
      rmSync(full, { recursive: true, force: true });
      removed++;
    } catch {
      // gone meanwhile or not ours to remove
    }
  }
  return removed;
}
