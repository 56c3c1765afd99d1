/**
 * A list under a parent (a study's specimens, a specimen's uploads) reads the parent's check and the
 * page together (access.ts, readAfterCheck). The answer for a parent that is not the lab's must stay
 * the 404 naming the parent — also for an id that is no UUID, which PostgreSQL refuses in the page's
 * query before the check has answered — and a good parent still lists its rows.
 */
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { readAfterCheck } from "@/lib/server/access";
import { notFound } from "@/lib/server/errors";
import { setupLabApi } from "../support/lab-api";

const lab = setupLabApi({ who: "manager" });
const STUDIES = "/api/v1/labs/[labId]/studies";
const SPECIMENS = `${STUDIES}/[studyId]/specimens`;
const UPLOADS = "/api/v1/labs/[labId]/specimens/[specimenId]/uploads";

describe("a list under a parent that is not the lab's", () => {
  it("answers 404 naming the study, for an unknown id and for an id that is no UUID", async () => {
    for (const studyId of [randomUUID(), "not-an-id", "42"]) {
      const res = await lab.api("GET", SPECIMENS, { params: { studyId } });
      expect(res.status, studyId).toBe(404);
      expect(res.body.error.code).toBe("not_found");
      expect(res.body.error.message).toMatch(/study/);
    }
  });

  it("answers 404 naming the specimen, for an unknown id and for an id that is no UUID", async () => {
    for (const specimenId of [randomUUID(), "not-an-id"]) {
      const res = await lab.api("GET", UPLOADS, { params: { specimenId } });
      expect(res.status, specimenId).toBe(404);
      expect(res.body.error.code).toBe("not_found");
      expect(res.body.error.message).toMatch(/specimen/);
    }
  });

  it("lists the rows of a parent that is the lab's", async () => {
    const study = await lab.api("POST", STUDIES, { json: { name: "Parent check", tissue: "skin", organism: "chick" } });
    const specimen = await lab.api("POST", SPECIMENS, {
      params: { studyId: study.body.id },
      json: { label: "E1", condition: "control" },
    });
    const specimens = await lab.api("GET", SPECIMENS, { params: { studyId: study.body.id } });
    expect(specimens.status).toBe(200);
    expect(specimens.body.items.map((s: { label: string }) => s.label)).toEqual(["E1"]);
    const uploads = await lab.api("GET", UPLOADS, { params: { specimenId: specimen.body.id } });
    expect(uploads.status).toBe(200);
    expect(uploads.body.items).toEqual([]);
  });
});

describe("readAfterCheck", () => {
  it("answers with the check's error when the read fails first", async () => {
    // The page's query refused at once, the parent's check answering later: the 404 must win.
    const check = new Promise((_, reject) => setTimeout(() => reject(notFound("study")), 20));
    const read = Promise.reject(new Error('invalid input syntax for type uuid: "42"'));
    await expect(readAfterCheck(check, read)).rejects.toThrow("study not found");
  });

  it("answers with the read's error when the check passes", async () => {
    const read = Promise.reject(new Error("the page's own failure"));
    await expect(readAfterCheck(Promise.resolve({ id: "s" }), read)).rejects.toThrow("the page's own failure");
  });

  it("answers with the read when both succeed", async () => {
    expect(await readAfterCheck(Promise.resolve({ id: "s" }), Promise.resolve([1, 2]))).toEqual([1, 2]);
  });
});
