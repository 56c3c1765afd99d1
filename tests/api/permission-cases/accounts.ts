/** Account routes: sign-up confirmation, password change and reset, e-mail change. */
import { createAccountLink } from "@/lib/server/accounts/account-links";
import { hashPassword } from "@/lib/server/accounts/passwords";
import { newSecret, sha256Hex } from "@/lib/server/secrets";
import { database } from "@/lib/server/services";
import { makePerson } from "../../support/world";
import { PUBLIC, USER, next, type Case } from "./shared";

/** Gives whoever calls a known password, so "current password" is right for them. */
async function knownPassword(w: Parameters<Case["setup"]>[0], who: Parameters<Case["setup"]>[1]) {
  const person = who === "anonymous" ? null : who === "outsider" ? w.outsider : w.people[who];
  if (person)
    await (
      await database()
    ).User.update({ passwordHash: await hashPassword("long-enough-pw") }, { where: { id: person.userId } });
}

export const cases: Record<string, Case> = {
  "POST /api/v1/signup/confirm": {
    setup: async () => {
      const m = await database();
      const token = newSecret("su");
      await m.SignupRequest.create({
        tokenHash: sha256Hex(token),
        email: `confirm${next()}@lab.test`,
        name: "N",
        labName: "New Lab",
        passwordHash: await hashPassword("long-enough-pw"),
        expiresAt: new Date(Date.now() + 3_600_000),
      });
      return { json: { token, password: "long-enough-pw" } };
    },
    expect: PUBLIC(201),
  },
  "POST /api/v1/me/password": {
    // Each caller first gets a known password, so the current one is right for whoever calls.
    setup: async (w, who) => {
      const person = who === "anonymous" ? null : who === "outsider" ? w.outsider : w.people[who];
      if (person)
        await (
          await database()
        ).User.update({ passwordHash: await hashPassword("long-enough-pw") }, { where: { id: person.userId } });
      return { json: { currentPassword: "long-enough-pw", newPassword: `another-password-${next()}` } };
    },
    expect: USER(200),
  },
  "POST /api/v1/password-reset": {
    // The same 202 for every caller and address (no enumeration); a link goes only to an account.
    setup: async () => ({ json: { email: `reset${next()}@lab.test` } }),
    expect: PUBLIC(202),
  },
  "POST /api/v1/password-reset/confirm": {
    // A fresh account's link each time: whoever holds the link may use it, signed in or not.
    setup: async (w) => {
      const p = await makePerson("collaborator", w.otherLabId, `reset${next()}`);
      const { token } = await createAccountLink(p.userId, "password-reset", 3_600_000);
      return { json: { token, newPassword: "a-brand-new-password" } };
    },
    expect: PUBLIC(200),
  },
  "POST /api/v1/me/email": {
    setup: async (w, who) => {
      await knownPassword(w, who);
      return { json: { newEmail: `moved${next()}@lab.test`, currentPassword: "long-enough-pw" } };
    },
    expect: USER(202),
  },
  "POST /api/v1/email-change/confirm": {
    setup: async (w) => {
      const p = await makePerson("collaborator", w.otherLabId, `move${next()}`);
      const { token } = await createAccountLink(p.userId, "email-change", 3_600_000, `moved${next()}@lab.test`);
      return { json: { token } };
    },
    expect: PUBLIC(200),
  },
};
