/**
 * `npm start` rebuilds only when a source file is newer than the build: the data folder under
 * storage/ changes with every use of the app and must not count (common practice, no source).
 */
import { mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { buildIsStale } from "@/lib/cli/local-stack";

let root: string;
const at = (rel: string, seconds: number, body = "x") => {
  const p = path.join(root, rel);
  mkdirSync(path.dirname(p), { recursive: true });
  writeFileSync(p, body);
  utimesSync(p, seconds, seconds);
};

afterEach(() => rmSync(root, { recursive: true, force: true }));

describe("buildIsStale", () => {
  it("ignores the data folder, stored objects and mail under storage/, and sees a changed source file", () => {
    root = mkdtempSync(path.join(tmpdir(), "morphokin-stale-"));
    at("lib/a.ts", 1_000);
    at("storage/keys.ts", 1_000);
    at(".next/BUILD_ID", 2_000);
    expect(buildIsStale(root)).toBe(false);
    at("storage/data/morphokin.sqlite", 3_000);
    at("storage/data/uploads-tmp/x/part.json", 3_000);
    at("storage/data-e2e/morphokin.sqlite-wal", 3_000);
    at("storage/objects/morphokin-dev/k._S3rver_metadata.json", 3_000);
    at("storage/mail/1.json", 3_000);
    expect(buildIsStale(root)).toBe(false);
    at("storage/keys.ts", 3_000);
    expect(buildIsStale(root)).toBe(true);
  });

  it("is stale without a build, and when a root config file changed", () => {
    root = mkdtempSync(path.join(tmpdir(), "morphokin-stale-"));
    at("app/page.tsx", 1_000);
    expect(buildIsStale(root)).toBe(true);
    at(".next/BUILD_ID", 2_000);
    at("next.config.ts", 1_500);
    expect(buildIsStale(root)).toBe(false);
    at("next.config.ts", 2_500);
    expect(buildIsStale(root)).toBe(true);
  });
});
