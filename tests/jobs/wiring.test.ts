/**
 * The one job design: every job kind the queue accepts has a handler in the composition root,
 * and every child-process entry started by name exists as a file of lib/workers/.
 */
import { existsSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { JOB_KIND_NAMES, JOB_TIME_LIMITS_S } from "@/lib/server/jobs/kinds";
import { JOB_CLEANUPS, JOB_HANDLERS } from "@/lib/server/jobs/wiring";
import { childEntryPath, type ChildName } from "@/lib/workers/start-child";

describe("job wiring", () => {
  it("maps every accepted kind to a handler and a time limit, and no other kind", () => {
    expect(Object.keys(JOB_HANDLERS).sort()).toEqual([...JOB_KIND_NAMES].sort());
    for (const kind of JOB_KIND_NAMES) {
      expect(typeof JOB_HANDLERS[kind]).toBe("function");
      expect(JOB_TIME_LIMITS_S[kind]).toBeGreaterThan(0);
    }
    // Kinds that write objects remove a killed attempt's objects (design choice, DEVELOPERS.md).
    expect(Object.keys(JOB_CLEANUPS).sort()).toEqual(["readout", "simulation"]);
  });

  it("starts each child process from a file of lib/workers/", () => {
    for (const name of ["readout", "fit", "simulate"] as ChildName[]) {
      const file = childEntryPath(name);
      expect(file).toMatch(new RegExp(`lib/workers/${name}-child\\.ts$`));
      expect(existsSync(file)).toBe(true);
    }
  });
});
