/**
 * Rate limits and lockout in front of next-auth's own routes (password sign-in and the sign-in
 * link request), answered the way next-auth's client reads its answers: JSON `{ url }` whose
 * `error` parameter the sign-in page turns into a sentence ("Locked:14" = locked for 14 minutes).
 */
import "server-only";
import {
  enforceRateLimit,
  addressOf,
  lockedForS,
  lockoutMessage,
  RateLimitedError,
  type LimitName,
} from "../web/rate-limit";
import { services } from "../services";
import { json } from "../web/http";

function limitedAnswer(code: "Locked" | "RateLimited", retryAfterS: number, message: string): Response {
  const minutes = Math.max(1, Math.ceil(retryAfterS / 60));
  const url = `${services().config.appUrl.replace(/\/$/, "")}/login?error=${code}:${minutes}`;
  return json({ url, error: { code: "rate_limited", message } }, 429, { "retry-after": String(retryAfterS) });
}

async function emailOf(request: Request): Promise<string | null> {
  try {
    const form = await request.clone().formData();
    const email = form.get("email");
    return typeof email === "string" && email ? email.trim().toLowerCase() : null;
  } catch {
    return null;
  }
}

/** Null to go on to next-auth, or the 429 answer. */
export async function guardAuthRequest(request: Request, segments: string[]): Promise<Response | null> {
  if (request.method !== "POST") return null;
  const [action, provider] = segments;
  let name: LimitName | null = null;
  if (action === "callback" && provider === "credentials") name = "signIn";
  if (action === "signin" && provider === "email") name = "signInLink";
  if (!name) return null;
  const email = await emailOf(request);
  if (name === "signIn" && email) {
    const locked = await lockedForS(email);
    if (locked > 0) return limitedAnswer("Locked", locked, lockoutMessage(locked));
  }
  try {
    await enforceRateLimit(name, { account: email, address: addressOf(request) });
  } catch (err) {
    if (err instanceof RateLimitedError) return limitedAnswer("RateLimited", err.retryAfterS, err.message);
    throw err;
  }
  return null;
}
