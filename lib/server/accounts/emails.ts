/** The e-mail addresses of users by id, for "created by" columns (a missing user is left out). */
import "server-only";
import { readAll } from "../db-read";
import { database } from "../services";

export async function emailsOf(ids: (string | null)[]): Promise<Map<string, string>> {
  const m = await database();
  const users = await readAll(m.User, {
    where: { id: [...new Set(ids.filter((x): x is string => !!x))] },
    attributes: ["id", "email"],
  });
  return new Map(users.map((u) => [u.id, u.email]));
}
