/**
 * Invitations bound to the invitee (issue 10, item 14): the e-mailed token is needed, and a
 * session (or API token) of another account is refused with a clear message; an existing
 * account accepts by its password or by being signed in as itself; the token works once.
 * Expected behaviour: the rules (common practice, no source).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hashPassword } from "@/lib/server/accounts/passwords";
import { newSecret, sha256Hex } from "@/lib/server/secrets";
import { database } from "@/lib/server/services";
import { call, discoverRoutes } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { makePerson, makeWorld, type Person, type World } from "../support/world";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
});
afterAll(async () => stack?.close());

async function invitationFor(email: string): Promise<string> {
  const m = await database();
  const token = newSecret("inv");
  await m.Invitation.create({
    labId: w.labId,
    email,
    role: "modeller",
    tokenHash: sha256Hex(token),
    invitedBy: w.people.manager.userId,
    expiresAt: new Date(Date.now() + 86_400_000),
  });
  return token;
}
const accept = (token: string, json: unknown, bearer?: string) =>
  call(routes.get("POST /api/v1/invitations/[token]/accept")!, "POST", "/api/v1/invitations/[token]/accept", {
    params: { token },
    json,
    token: bearer,
  });
const errorOf = async (res: Response) => ((await res.json()) as { error: { message: string } }).error.message;

/** Someone with an account in the other lab, with a known password. */
async function existingPerson(): Promise<Person> {
  const p = await makePerson("scientist", w.otherLabId, "existing");
  await (
    await database()
  ).User.update({ passwordHash: await hashPassword("their-own-password") }, { where: { id: p.userId } });
  return p;
}

describe("accepting an invitation", () => {
  it("is refused while signed in as another account, with who is who, and the invitation stays usable", async () => {
    const email = `newcomer-${Date.now()}@lab.test`;
    const token = await invitationFor(email);
    const res = await accept(token, { name: "New Comer", password: "long-enough-pw" }, w.outsider.token);
    expect(res.status).toBe(403);
    expect(await errorOf(res)).toBe(
      `You are signed in as ${w.outsider.email}; this invitation is for ${email}. Sign out first.`,
    );
    expect(await (await database()).User.count({ where: { email } })).toBe(0);
    expect((await accept(token, { name: "New Comer", password: "long-enough-pw" })).status).toBe(200);
  });

  it("an existing account needs its own password when not signed in", async () => {
    const p = await existingPerson();
    const token = await invitationFor(p.email);
    const none = await accept(token, {});
    expect(none.status).toBe(400);
    expect(await errorOf(none)).toBe(`password: enter the password of your account ${p.email}`);
    const wrong = await accept(token, { password: "a-guessed-password" });
    expect(wrong.status).toBe(401);
    expect((await accept(token, { password: "their-own-password" })).status).toBe(200);
    const m = await database();
    expect(await m.Membership.findOne({ where: { labId: w.labId, userId: p.userId } })).toMatchObject({
      role: "modeller",
    });
  });

  it("an existing account signed in as itself accepts without a password, once", async () => {
    const p = await existingPerson();
    const token = await invitationFor(p.email);
    expect((await accept(token, {}, p.token)).status).toBe(200);
    const again = await accept(token, {}, p.token);
    expect(again.status).toBe(409);
    expect(await errorOf(again)).toBe("this invitation was already used; sign in instead");
  });

  it("a new person needs a name and a password", async () => {
    const token = await invitationFor(`nameless-${Date.now()}@lab.test`);
    const res = await accept(token, { password: "long-enough-pw" });
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toBe("name: enter your name");
    const nopw = await accept(token, { name: "Has Name" });
    expect(nopw.status).toBe(400);
    expect(await errorOf(nopw)).toBe("password: choose a password");
  });
});
