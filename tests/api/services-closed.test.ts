/**
 * Work that outlives its test stack (a setup hook that timed out and went on in the background, a
 * late promise) must not open the configured default database: it would create, and leave
 * half-migrated, storage/data/morphokin.sqlite in the developer's clone, and `npm start` there then
 * fails. Expected: a clear error, and no file under storage/data (product rule, no source).
 */
import { existsSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseConfig } from "@/lib/server/config";
import { database, services } from "@/lib/server/services";
import { startTestStack } from "../support/stack";
import { makeWorld } from "../support/world";

const DEFAULT_FILE = parseConfig({}).databasePath;

describe("services after a test stack closed", () => {
  it("refuse instead of opening the default database, and leave no file in storage/data", async () => {
    const existedBefore = existsSync(DEFAULT_FILE);
    const stack = await startTestStack();
    await makeWorld();
    await stack.close();
    expect(() => services()).toThrow("the services of this test were closed");
    await expect(database()).rejects.toThrow("the services of this test were closed");
    // A fresh clone has no such file; a developer's own one is left alone either way.
    if (!existedBefore) expect(existsSync(DEFAULT_FILE)).toBe(false);
    expect(path.relative(process.cwd(), DEFAULT_FILE)).toBe(path.join("storage", "data", "morphokin.sqlite"));
  });

  it("a new stack after a closed one works as before", async () => {
    const stack = await startTestStack();
    try {
      expect(services()).toBe(stack.services);
      expect((await makeWorld()).labId).toEqual(expect.any(String));
    } finally {
      await stack.close();
    }
  });
});
