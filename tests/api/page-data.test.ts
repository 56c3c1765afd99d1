/**
 * The pages' data calls (lib/server/<feature>/pages.ts, lib/server/labs/dashboard.ts): one call per
 * page, lab kinetics read in one query whatever their number, and database errors that reach the
 * page's error boundary instead of silently dropping rows.
 */
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { requireLab, type LabContext } from "@/lib/server/access";
import { createThread, listThreads } from "@/lib/server/discussions/discussions";
import { loadNewFitPage } from "@/lib/server/fits/pages";
import { createLabKinetics, updateLabKinetics } from "@/lib/server/kinetics/kinetics";
import { loadKineticsEditPage, loadLabKineticsPage } from "@/lib/server/kinetics/pages";
import { loadDashboard } from "@/lib/server/labs/dashboard";
import { loadNewRunPage } from "@/lib/server/runs/pages";
import { database, services } from "@/lib/server/services";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";
import { labSchnakenberg } from "./permission-cases/kinetics";
import { upload } from "./permission-cases/shared";

let stack: TestStack;
let w: World;
let manager: LabContext;
let kineticsIds: string[];
beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  manager = await requireLab(w.people.manager.actor, w.labId);
  kineticsIds = [];
  for (const name of ["Alpha kinetics", "Beta kinetics", "Gamma kinetics"])
    kineticsIds.push((await createLabKinetics(manager, { description: null, definition: labSchnakenberg(name) })).id);
  // Beta gets a second version, so "latest" and "pinned" differ.
  await updateLabKinetics(manager, kineticsIds[1], {
    description: null,
    definition: { ...labSchnakenberg("Beta kinetics"), source: "second version" },
  });
});
afterAll(async () => stack?.close());
afterEach(() => vi.restoreAllMocks());

const labOnes = (kinetics: { kind: string; name: string; version: number | null }[]) =>
  kinetics.filter((k) => k.kind === "lab").map((k) => `${k.name} v${k.version}`);

describe("new fit page", () => {
  it("lists every lab kinetics at its latest version after the catalogue, reading versions once", async () => {
    const m = await database();
    const findOne = vi.spyOn(m.KineticsVersion, "findOne");
    const findAll = vi.spyOn(m.KineticsVersion, "findAll");
    const data = await loadNewFitPage(manager, {});
    expect(labOnes(data.kinetics)).toEqual(["Alpha kinetics v1", "Beta kinetics v2", "Gamma kinetics v1"]);
    expect(data.kinetics[0].kind).toBe("catalogue");
    expect(data.notice).toBeNull();
    // One query for all versions, none per kinetics (no N+1).
    expect(findOne).not.toHaveBeenCalled();
    expect(findAll).toHaveBeenCalledTimes(1);
  });

  it("describes the kinetics a link pinned at the version it names", async () => {
    const data = await loadNewFitPage(manager, { kinetics: kineticsIds[1], version: "1" });
    expect(labOnes(data.kinetics)).toEqual(["Alpha kinetics v1", "Beta kinetics v1", "Gamma kinetics v1"]);
    expect(data.notice).toBeNull();
  });

  it("offers the latest version and says so when the pinned version does not exist (before: the kinetics vanished)", async () => {
    const data = await loadNewFitPage(manager, { kinetics: kineticsIds[1], version: "7" });
    expect(labOnes(data.kinetics)).toEqual(["Alpha kinetics v1", "Beta kinetics v2", "Gamma kinetics v1"]);
    expect(data.notice).toBe("Version 7 of “Beta kinetics” does not exist; its latest version, 2, is offered instead.");
  });

  it("lets a database error through to the page's error boundary instead of dropping kinetics", async () => {
    const m = await database();
    vi.spyOn(m.KineticsVersion, "findAll").mockRejectedValueOnce(new Error("SQLITE_BUSY: database is locked"));
    await expect(loadNewFitPage(manager, {})).rejects.toThrow("SQLITE_BUSY");
  });
});

describe("new run page", () => {
  it("lists the lab kinetics like the fit builder, with no fit notice when no fit is named", async () => {
    const data = await loadNewRunPage(manager, null);
    expect(labOnes(data.kinetics)).toEqual(["Alpha kinetics v1", "Beta kinetics v2", "Gamma kinetics v1"]);
    expect(data.fitStart).toBeNull();
    expect(data.fitNotice).toBeNull();
  });

  it("states why a fit named by a stale link cannot seed the run", async () => {
    const data = await loadNewRunPage(manager, { fitId: "00000000-0000-4000-8000-000000000000", condition: "wt" });
    expect(data.fitStart).toBeNull();
    expect(data.fitNotice).toMatch(/not found/i);
  });
});

describe("kinetics pages", () => {
  it("reads the kinetics, the version shown and every version together", async () => {
    const data = await loadLabKineticsPage(manager, kineticsIds[1], 1);
    expect(data.lab.name).toBe("Beta kinetics");
    expect(data.info.version).toBe(1);
    expect(data.versions.map((v) => v.version)).toEqual([2, 1]);
    const edit = await loadKineticsEditPage(manager, kineticsIds[1]);
    expect(edit.latest.version).toBe(2);
  });

  it("answers not found for a version that does not exist", async () => {
    await expect(loadLabKineticsPage(manager, kineticsIds[1], 9)).rejects.toMatchObject({ code: "not_found" });
  });
});

describe("dashboard", () => {
  it("reads its four lists at the same time: all four start before the first one ends", async () => {
    // The lists are read by written-out SELECTs (lib/server/db-read.ts); each list's first query marks its start.
    const db = services().db;
    const tables: Record<string, string> = {
      studies: "studies",
      fits: "fits",
      readouts: "readouts",
      audit_events: "audit",
    };
    const started: string[] = [];
    let firstDone = -1;
    const original = db.select.bind(db);
    vi.spyOn(db, "select").mockImplementation((sql, bind) => {
      const table = /\bFROM "(\w+)" "r"/.exec(sql)?.[1];
      const name = table ? tables[table] : undefined;
      if (!name) return original(sql, bind);
      if (!started.includes(name)) started.push(name);
      return original(sql, bind).finally(() => {
        if (firstDone < 0) firstDone = started.length;
      });
    });
    const data = await loadDashboard(manager);
    expect(data.studies.total).toBe(0);
    expect(data.audit).not.toBeNull();
    expect(started.sort()).toEqual(["audit", "fits", "readouts", "studies"]);
    expect(firstDone).toBe(4);
  });

  it("leaves the audit trail out for a role that may not read it (permission table: audit.read)", async () => {
    const collaborator = await requireLab(w.people.collaborator.actor, w.labId);
    expect((await loadDashboard(collaborator)).audit).toBeNull();
  });
});

describe("open discussions (dashboard panel)", () => {
  it("names every thread's object with one query per kind of object, not one per thread", async () => {
    const files = [await upload(w), await upload(w), await upload(w)];
    for (const f of files) await createThread(manager, { targetType: "upload", targetId: f.id, body: "Spacing?" });
    const m = await database();
    const findOne = vi.spyOn(m.Upload, "findOne");
    const findAll = vi.spyOn(m.Upload, "findAll");
    const list = await listThreads(manager, {}, { page: 1, pageSize: 20, sort: "lastActivityAt", dir: "desc", q: "" });
    expect(list.items.filter((t) => t.target.type === "upload")).toHaveLength(3);
    expect(list.items.every((t) => t.target.label.startsWith("the file “a.png”"))).toBe(true);
    expect(findOne).not.toHaveBeenCalled();
    expect(findAll).toHaveBeenCalledTimes(1);
  });
});
