/** Account routes added with sign-up confirmation and password change. */
import { hashPassword } from "@/lib/server/accounts/passwords";
import { newSecret, sha256Hex } from "@/lib/server/secrets";
import { database } from "@/lib/server/services";
import { PUBLIC, USER, next, type Case } from "./shared";

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
};
