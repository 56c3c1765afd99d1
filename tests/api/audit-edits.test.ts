/** Edits of studies and specimens are in the lab's audit trail: field by field, old → new. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createSpecimen, updateSpecimen } from "@/lib/server/studies/specimens";
import { createStudy, updateStudy } from "@/lib/server/studies/studies";
import { database } from "@/lib/server/services";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
});
afterAll(async () => stack?.close());

const ctx = () => ({
  actor: w.people.scientist.actor,
  labId: w.labId,
  labName: "Test Lab",
  role: "scientist" as const,
});
const eventsOf = async (targetId: string, action: string) =>
  (await database()).AuditEvent.findAll({ where: { targetId, action } });

describe("edit events", () => {
  it("a study edit records each changed field with its old and new value", async () => {
    const s = await createStudy(ctx(), { name: "Feather buds", tissue: "skin", organism: "chick", description: null });
    await updateStudy(ctx(), s.id, { name: "Feather buds", tissue: "dorsal skin", description: "E7 explants" });
    const [e] = await eventsOf(s.id, "study.edited");
    expect(e.summary).toBe(
      `${w.people.scientist.email} edited the study “Feather buds”: Tissue “skin” → “dorsal skin”; Description (empty) → “E7 explants”`,
    );
    expect(e.details).toEqual({
      changes: [
        { field: "Tissue", from: "skin", to: "dorsal skin" },
        { field: "Description", from: null, to: "E7 explants" },
      ],
    });
    expect(e.actorEmail).toBe(w.people.scientist.email);
  });

  it("a specimen edit records the change; an edit that changes nothing records nothing", async () => {
    const study = await createStudy(ctx(), { name: "Rugae", tissue: "palate", organism: "mouse", description: null });
    const sp = await createSpecimen(ctx(), study.id, {
      label: "P-1",
      condition: "control",
      stage: null,
      genotype: null,
      notes: null,
    });
    await updateSpecimen(ctx(), sp.id, { condition: "treated", notes: "x".repeat(100) });
    await updateSpecimen(ctx(), sp.id, { condition: "treated" });
    const events = await eventsOf(sp.id, "specimen.edited");
    expect(events).toHaveLength(1);
    // Long texts are shortened to 60 characters in the sentence (design choice) and kept whole in the details.
    expect(events[0].summary).toBe(
      `${w.people.scientist.email} edited specimen “P-1”: Condition “control” → “treated”; Notes (empty) → “${"x".repeat(60)}…”`,
    );
    expect((events[0].details as { changes: { to: string }[] }).changes[1].to).toBe("x".repeat(100));
  });
});
