import "server-only";
import bcrypt from "bcryptjs";

const COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

/**
 * A bcrypt hash (cost 10, as COST) of random bytes nobody kept, so an unknown address costs one
 * compare too. A literal, not computed at first use: computing it would make that first answer slower.
 */
const DUMMY_HASH = "$2b$10$8mtp4FNez3xWyzeij1JKqefYSyPY1oHhXNiwv19Eux.LP3MiyD7r.";

/**
 * True when `password` matches `hash`. Without a hash (no account, or an account without a
 * password) it still runs one bcrypt compare against a dummy hash, so the answer takes the same
 * time either way and does not tell whether the address has an account.
 */
export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    await bcrypt.compare(password, DUMMY_HASH);
    return false;
  }
  return bcrypt.compare(password, hash);
}
