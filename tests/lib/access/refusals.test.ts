/**
 * A role refused an action in its own lab is told so in words, read from the one permission
 * table (lib/access/permissions.ts; roles as the product guide states them).
 */
import { describe, expect, it } from "vitest";
import { ACTIONS, can } from "@/lib/access/permissions";
import { ACTIONS_WITH_WORDS, describeRefusal } from "@/lib/access/refusals";
import { ROLES } from "@/lib/access/roles";

describe("describeRefusal", () => {
  it("says what the role may and may not do", () => {
    expect(describeRefusal("collaborator", "fit.create")).toBe("Collaborators can read fits but not start them.");
    expect(describeRefusal("scientist", "run.create")).toBe(
      "Bench scientists can read verification runs but not start them.",
    );
    expect(describeRefusal("scientist", "kinetics.edit")).toBe(
      "Bench scientists can read and analyse kinetics but not define or edit them.",
    );
  });

  it("names the roles that may, for what the others do not see at all", () => {
    expect(describeRefusal("modeller", "audit.read")).toBe("Only lab managers can read the audit trail.");
  });

  it("every action has words, and every refused role × action gives a sentence without JSON names", () => {
    expect(ACTIONS_WITH_WORDS).toEqual(ACTIONS);
    for (const role of ROLES)
      for (const action of ACTIONS)
        if (!can(role, action)) expect(describeRefusal(role, action)).toMatch(/^[A-Z][^.]*[a-z ]\.$/);
  });
});
