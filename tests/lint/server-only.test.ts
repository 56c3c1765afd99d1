/**
 * Every file of lib/server carries the `server-only` marker, so a client component that imports
 * a value from it fails the build instead of shipping server code (and secrets) to the browser
 * (node_modules/next/dist/docs/01-app/02-guides/data-security.md, "Preventing client-side
 * execution of server-only code").
 */
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { expect, it } from "vitest";

const ROOT = path.resolve(import.meta.dirname, "../..");

function tsFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? tsFiles(p) : e.name.endsWith(".ts") ? [p] : [];
  });
}

it("every lib/server file imports server-only", () => {
  const files = tsFiles(path.join(ROOT, "lib/server"));
  expect(files.length).toBeGreaterThan(50);
  const missing = files.filter((f) => !/^import "server-only";$/m.test(readFileSync(f, "utf8")));
  expect(missing.map((f) => path.relative(ROOT, f))).toEqual([]);
});
