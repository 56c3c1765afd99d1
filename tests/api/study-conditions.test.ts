/**
 * A study's conditions as a list: spellings that differ only in case and spaces are one condition,
 * shown as most specimens spell it; renaming renames it on every specimen of the study (and nowhere
 * else), audited; bad input names the field.
 */
import { describe, expect, it } from "vitest";
import { database } from "@/lib/server/services";
import { setupLabApi } from "../support/lab-api";

const lab = setupLabApi({ who: "manager" });
const STUDIES = "/api/v1/labs/[labId]/studies";
const CONDITIONS = `${STUDIES}/[studyId]/conditions`;

async function studyWith(conditions: string[]) {
  const s = await lab.api("POST", STUDIES, {
    json: { name: `Study ${Math.random()}`, tissue: "skin", organism: "chick" },
  });
  for (const [i, condition] of conditions.entries())
    await lab.api("POST", `${STUDIES}/[studyId]/specimens`, {
      params: { studyId: s.body.id },
      json: { label: `E${i + 1}`, condition },
    });
  return s.body.id as string;
}

describe("conditions of a study", () => {
  it("lists each condition once with its specimen count and other spellings", async () => {
    const studyId = await studyWith(["Kontrolle", "kontrolle", " Kontrolle ", "Inhibitor"]);
    const res = await lab.api("GET", CONDITIONS, { params: { studyId } });
    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([
      { name: "Inhibitor", specimens: 1, otherSpellings: [] },
      { name: "Kontrolle", specimens: 3, otherSpellings: ["kontrolle"] },
    ]);
  });

  it("renames a condition on every specimen of the study, and only there", async () => {
    const studyId = await studyWith(["Kontrolle", "kontrolle", "Inhibitor"]);
    const other = await studyWith(["Kontrolle"]);
    const res = await lab.api("PATCH", CONDITIONS, {
      params: { studyId },
      json: { from: "KONTROLLE", to: " control " },
    });
    expect(res.status).toBe(200);
    expect(res.body.renamed).toBe(2);
    expect(res.body.conditions.map((c: { name: string }) => c.name)).toEqual(["control", "Inhibitor"]);
    const m = await database();
    const mine = await m.Specimen.findAll({ where: { studyId }, order: [["label", "asc"]] });
    expect(mine.map((s) => s.condition)).toEqual(["control", "control", "Inhibitor"]);
    expect((await m.Specimen.findOne({ where: { studyId: other } }))!.condition).toBe("Kontrolle");
    const audit = await m.AuditEvent.findOne({ where: { targetId: studyId, action: "study.condition-renamed" } });
    expect(audit!.summary).toContain("renamed the condition “KONTROLLE” to “control” on 2 specimen(s)");
  });

  it("names the field when the input is wrong", async () => {
    const studyId = await studyWith(["control"]);
    const missing = await lab.api("PATCH", CONDITIONS, { params: { studyId }, json: { from: "treated", to: "x" } });
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toBe("No specimen of this study has the condition “treated”.");
    const empty = await lab.api("PATCH", CONDITIONS, { params: { studyId }, json: { from: "control", to: "  " } });
    expect(empty.status).toBe(400);
    expect(empty.body.error.message).toContain("to: name the new condition");
  });
});
