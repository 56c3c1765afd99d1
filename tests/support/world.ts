/**
 * A lab with one member per role plus an outsider (manager of another lab), each with an API
 * token, built through the same data-access functions the app uses.
 */
import { ROLES, type Role } from "@/lib/access/roles";
import { createToken } from "@/lib/server/accounts/tokens";
import { signUp } from "@/lib/server/accounts/accounts";
import { database } from "@/lib/server/services";
import type { Actor } from "@/lib/server/accounts/actor";

export interface Person {
  userId: string;
  email: string;
  token: string;
  actor: Actor;
}

export interface World {
  labId: string;
  otherLabId: string;
  people: Record<Role, Person>;
  outsider: Person;
}

let counter = 0;

export async function makePerson(role: Role, labId: string, prefix = "p"): Promise<Person> {
  const m = await database();
  const email = `${prefix}-${role}-${++counter}@lab.test`;
  const user = await m.User.create({ name: `${role} ${counter}`, email, passwordHash: null, emailVerified: null });
  await m.Membership.create({ labId, userId: user.id, role });
  const actor: Actor = { userId: user.id, email, name: user.name, via: "token" };
  return { userId: user.id, email, actor, token: (await createToken(actor, "tests")).secret };
}

export async function makeWorld(): Promise<World> {
  const m = await database();
  const first = await signUp({
    name: "Lead",
    email: `lead-${++counter}@lab.test`,
    password: "long-enough-pw",
    labName: "Test Lab",
  });
  const lead = await m.User.findByPk(first.userId);
  const leadActor: Actor = { userId: lead!.id, email: lead!.email, name: lead!.name, via: "token" };
  const people = {
    manager: {
      userId: lead!.id,
      email: lead!.email,
      actor: leadActor,
      token: (await createToken(leadActor, "tests")).secret,
    },
  } as Record<Role, Person>;
  for (const role of ROLES) if (role !== "manager") people[role] = await makePerson(role, first.labId);
  const other = await signUp({
    name: "Other",
    email: `other-${++counter}@lab.test`,
    password: "long-enough-pw",
    labName: "Other Lab",
  });
  const o = await m.User.findByPk(other.userId);
  const oActor: Actor = { userId: o!.id, email: o!.email, name: o!.name, via: "token" };
  return {
    labId: first.labId,
    otherLabId: other.labId,
    people,
    outsider: { userId: o!.id, email: o!.email, actor: oActor, token: (await createToken(oActor, "tests")).secret },
  };
}
