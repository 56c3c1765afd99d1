/** The permission table against PRODUCT.md's role descriptions (product rules, no source). */
import { describe, expect, it } from "vitest";
import { ACTIONS, can, scopeOf } from "@/lib/access/permissions";
import { ROLES } from "@/lib/access/roles";

describe("permission table", () => {
  it("a lab manager may do everything, on anything", () => {
    for (const a of ACTIONS) expect(can("manager", a, { ownerId: "someone", actorId: "me" })).toBe(true);
  });

  it("a collaborator may read and comment (and edit or delete their own comments), nothing else", () => {
    const allowed = ACTIONS.filter((a) => scopeOf("collaborator", a) !== false);
    expect(allowed.sort()).toEqual([
      "comment.create",
      "comment.delete",
      "comment.edit",
      "lab.read",
      "member.list",
      "upload.read",
    ]);
    expect(scopeOf("collaborator", "comment.edit")).toBe("own");
    expect(scopeOf("collaborator", "comment.delete")).toBe("own");
  });

  it("scientists and modellers edit only what they created", () => {
    for (const role of ["scientist", "modeller"] as const) {
      expect(can(role, "study.edit", { ownerId: "me", actorId: "me" })).toBe(true);
      expect(can(role, "study.edit", { ownerId: "other", actorId: "me" })).toBe(false);
      expect(can(role, "upload.delete", { ownerId: null, actorId: "me" })).toBe(false);
    }
  });

  it("only modellers (own) and managers define kinetics; nobody but managers handles access", () => {
    expect(ROLES.filter((r) => scopeOf(r, "kinetics.edit") !== false)).toEqual(["manager", "modeller"]);
    for (const a of ["member.manage", "invitation.manage", "audit.read"] as const)
      expect(ROLES.filter((r) => can(r, a))).toEqual(["manager"]);
  });
});
