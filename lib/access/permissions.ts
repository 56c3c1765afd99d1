/**
 * The one permission table. Every route handler and server action asks `can()` (through
 * `lib/server/access.ts`) before it reads or changes anything in a lab.
 *
 * "own" means the rule applies only to objects the actor created; the lab manager may act on
 * everything in the lab ("any").
 */
import type { Role } from "./roles";

export type Scope = "any" | "own" | false;

export const ACTIONS = [
  "lab.read",
  "lab.rename",
  "member.list",
  "member.manage",
  "invitation.manage",
  "audit.read",
  "mailbox.read",
  "study.create",
  "study.edit",
  "study.delete",
  "specimen.create",
  "specimen.edit",
  "specimen.delete",
  "upload.create",
  "upload.read",
  "upload.delete",
  "readout.create",
  "comment.create",
  "comment.edit",
  "comment.delete",
  "kinetics.edit",
  "fit.create",
  "job.cancel",
  "run.create",
] as const;
export type Action = (typeof ACTIONS)[number];

const table: Record<Action, Record<Role, Scope>> = {
  "lab.read": { manager: "any", scientist: "any", modeller: "any", collaborator: "any" },
  "lab.rename": { manager: "any", scientist: false, modeller: false, collaborator: false },
  "member.list": { manager: "any", scientist: "any", modeller: "any", collaborator: "any" },
  "member.manage": { manager: "any", scientist: false, modeller: false, collaborator: false },
  "invitation.manage": { manager: "any", scientist: false, modeller: false, collaborator: false },
  "audit.read": { manager: "any", scientist: false, modeller: false, collaborator: false },
  "mailbox.read": { manager: "any", scientist: false, modeller: false, collaborator: false },
  "study.create": { manager: "any", scientist: "any", modeller: "any", collaborator: false },
  "study.edit": { manager: "any", scientist: "own", modeller: "own", collaborator: false },
  "study.delete": { manager: "any", scientist: "own", modeller: "own", collaborator: false },
  "specimen.create": { manager: "any", scientist: "any", modeller: "any", collaborator: false },
  "specimen.edit": { manager: "any", scientist: "own", modeller: "own", collaborator: false },
  "specimen.delete": { manager: "any", scientist: "own", modeller: "own", collaborator: false },
  "upload.create": { manager: "any", scientist: "any", modeller: "any", collaborator: false },
  "upload.read": { manager: "any", scientist: "any", modeller: "any", collaborator: "any" },
  "upload.delete": { manager: "any", scientist: "own", modeller: "own", collaborator: false },
  "readout.create": { manager: "any", scientist: "any", modeller: "any", collaborator: false },
  "comment.create": { manager: "any", scientist: "any", modeller: "any", collaborator: "any" },
  "comment.edit": { manager: "any", scientist: "own", modeller: "own", collaborator: "own" },
  "comment.delete": { manager: "any", scientist: "own", modeller: "own", collaborator: "own" },
  "kinetics.edit": { manager: "any", scientist: false, modeller: "own", collaborator: false },
  "fit.create": { manager: "any", scientist: "any", modeller: "any", collaborator: false },
  "job.cancel": { manager: "any", scientist: "own", modeller: "own", collaborator: false },
  "run.create": { manager: "any", scientist: false, modeller: "any", collaborator: false },
};

/** Whether `role` may do `action`; pass `ownerId`/`actorId` for actions on an existing object. */
export function can(role: Role, action: Action, object?: { ownerId: string | null; actorId: string }): boolean {
  const scope = table[action][role];
  if (scope === "any") return true;
  if (scope === "own") return object === undefined || (object.ownerId !== null && object.ownerId === object.actorId);
  return false;
}

/** The scope itself, for UIs that show or hide buttons. */
export function scopeOf(role: Role, action: Action): Scope {
  return table[action][role];
}
