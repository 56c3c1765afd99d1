/** Roles are per lab. Stored values are the left-hand words; labels are what people read. */
export const ROLES = ["manager", "scientist", "modeller", "collaborator"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  manager: "Lab manager",
  scientist: "Bench scientist",
  modeller: "Modeller",
  collaborator: "Collaborator",
};

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

/** What each role may do, in the product guide's words (shown before a role is changed). */
export const ROLE_MAY_DO: Record<Role, string> = {
  manager:
    "everything a modeller may, plus members, roles, invitations, API tokens, deleting anything in the lab, the audit trail",
  scientist: "studies, specimens, uploads, spacing readouts, fits with existing kinetics, comments",
  modeller: "everything a bench scientist may, plus defining and editing kinetics, verification runs",
  collaborator: "read everything in the lab, comment; nothing else",
};
