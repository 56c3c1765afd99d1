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
