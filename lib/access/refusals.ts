/**
 * What a lab member is told when their role may not do something in a lab they belong to:
 * "Collaborators can read fits but not start them." — the role and the action in words, with a
 * 403, never the "not found" that another lab's objects answer. Read from the one permission
 * table, so the words cannot drift from what is allowed.
 */
import { ACTIONS, scopeOf, type Action } from "./permissions";
import { ROLES, type Role } from "./roles";

/** Roles as a sentence names them, in the plural. */
export const ROLE_PLURALS: Record<Role, string> = {
  manager: "Lab managers",
  scientist: "Bench scientists",
  modeller: "Modellers",
  collaborator: "Collaborators",
};

/** Each action in words: what the refused role may still do (`still`) and what it may not (`act`). */
const ACTION_WORDS: Record<Action, { still?: string; act: string }> = {
  "lab.read": { act: "open this lab" },
  "lab.rename": { still: "read the lab", act: "rename it" },
  "member.list": { act: "see the lab's members" },
  "member.manage": { still: "see the lab's members", act: "change their roles or remove them" },
  "invitation.manage": { still: "see the lab's members", act: "invite people" },
  "audit.read": { act: "read the audit trail" },
  "mailbox.read": { act: "read the development mailbox" },
  "study.create": { still: "read studies", act: "create them" },
  "study.edit": { still: "read studies", act: "change them" },
  "study.delete": { still: "read studies", act: "delete them" },
  "specimen.create": { still: "read specimens", act: "add them" },
  "specimen.edit": { still: "read specimens", act: "change them" },
  "specimen.delete": { still: "read specimens", act: "delete them" },
  "upload.create": { still: "read uploads and readouts", act: "upload files" },
  "upload.read": { act: "read uploads" },
  "upload.delete": { still: "read uploads", act: "delete them" },
  "readout.create": { still: "read readouts", act: "start them" },
  "comment.create": { still: "read discussions", act: "comment" },
  "comment.edit": { still: "read comments", act: "change them" },
  "comment.delete": { still: "read comments", act: "delete them" },
  "kinetics.edit": { still: "read and analyse kinetics", act: "define or edit them" },
  "fit.create": { still: "read fits", act: "start them" },
  "job.cancel": { still: "follow jobs", act: "cancel them" },
  "run.create": { still: "read verification runs", act: "start them" },
};

/** "lab managers", "bench scientists, modellers and lab managers": the roles that may act. */
function allowedRoles(action: Action): string {
  const names = ROLES.filter((r) => scopeOf(r, action) !== false).map((r) => ROLE_PLURALS[r].toLowerCase());
  return names.length <= 1 ? (names[0] ?? "nobody") : `${names.slice(0, -1).join(", ")} and ${names.at(-1)}`;
}

/**
 * The sentence for `role` refused `action`: "Collaborators can read fits but not start them." or,
 * for what only some roles see at all, "Only lab managers can read the audit trail."
 */
export function describeRefusal(role: Role, action: Action): string {
  const words = ACTION_WORDS[action];
  if (words.still) return `${ROLE_PLURALS[role]} can ${words.still} but not ${words.act}.`;
  return `Only ${allowedRoles(action)} can ${words.act}.`;
}

/** Every action has its words (checked by tests/lib/access/refusals.test.ts). */
export const ACTIONS_WITH_WORDS: readonly Action[] = ACTIONS.filter((a) => ACTION_WORDS[a] !== undefined);
