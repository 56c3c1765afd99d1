/**
 * A vitest globalSetup (both projects, vitest.config.mts): the run fails when it leaves new files
 * in the default data folder, storage/data/ (MORPHOKIN_DATA_DIR's default, lib/server/config-env.ts).
 * Every test works in a temp folder of its own (tests/support/stack.ts), and every process a test
 * starts gets that folder and database (`stackChildEnv`); a file here means one did not, and
 * `npm start` in the clone would then meet a database the tests left behind (half-migrated).
 */
import { readdirSync } from "node:fs";
import path from "node:path";

export const DEFAULT_DATA_DIR = path.resolve("storage", "data");

/** Every file under `dir`, relative to the project folder; none when it does not exist. */
export function listFilesUnder(dir: string): string[] {
  try {
    return readdirSync(dir, { recursive: true, withFileTypes: true })
      .filter((e) => !e.isDirectory())
      .map((e) => path.relative(process.cwd(), path.join(e.parentPath, e.name)))
      .sort();
  } catch {
    return [];
  }
}

/** Files in `after` that were not in `before`, as the message of a failed run; null when none. */
export function describeLeftFiles(before: string[], after: string[]): string | null {
  const known = new Set(before);
  const left = after.filter((f) => !known.has(f));
  if (!left.length) return null;
  return (
    `the tests left ${left.length} new file(s) in the default data folder (${left.slice(0, 5).join(", ")}` +
    `${left.length > 5 ? ", …" : ""}): a test, or a process it started, used the default database or data ` +
    "folder instead of its own; start children with stackChildEnv(stack) (tests/support/stack.ts). " +
    "(A development server running from this folder meanwhile also writes there.)"
  );
}

export default function setup(): () => void {
  const before = listFilesUnder(DEFAULT_DATA_DIR);
  return () => {
    const problem = describeLeftFiles(before, listFilesUnder(DEFAULT_DATA_DIR));
    if (!problem) return;
    // An error in a global teardown is printed but does not fail the run by itself.
    process.exitCode = 1;
    throw new Error(problem);
  };
}
