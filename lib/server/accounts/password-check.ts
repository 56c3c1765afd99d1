/**
 * The password check of a form that asks for one (sign-up confirmation, change of password or of
 * e-mail): refused while the account is locked out, and a wrong password counts toward the lockout
 * as a wrong sign-in does (lib/server/web/rate-limit.ts).
 */
import "server-only";
import { AppError } from "../errors";
import { lockedForS, lockoutMessage, RateLimitedError, recordFailedPassword } from "../web/rate-limit";
import { verifyPassword } from "./passwords";

/** Resolves when `password` matches `hash`; else throws a 429 (locked out) or a 401 saying `wrong`. */
export async function checkPasswordOrRefuse(email: string, password: string, hash: string | null, wrong: string) {
  const locked = await lockedForS(email);
  if (locked > 0) throw new RateLimitedError(lockoutMessage(locked), locked);
  if (!(await verifyPassword(password, hash))) {
    await recordFailedPassword(email);
    throw new AppError("unauthenticated", wrong);
  }
}
