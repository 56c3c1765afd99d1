import bcrypt from "bcryptjs";

const COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

/** A hash of nothing anyone types, at the same cost, so an unknown address costs one compare too. */
let dummyHash: string | null = null;
function dummy(): string {
  return (dummyHash ??= bcrypt.hashSync("no account has this password: it only spends the same time", COST));
}

/**
 * True when `password` matches `hash`. Without a hash (no account, or an account without a
 * password) it still runs one bcrypt compare against a dummy hash, so the answer takes the same
 * time either way and does not tell whether the address has an account.
 */
export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    await bcrypt.compare(password, dummy());
    return false;
  }
  return bcrypt.compare(password, hash);
}
