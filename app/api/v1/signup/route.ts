import { signupSchema } from "@/lib/contracts/account";
import { requestSignup } from "@/lib/server/accounts/accounts";
import { json, readJson } from "@/lib/server/web/http";
import { publicRoute } from "@/lib/server/web/lab-route";
import { addressOf } from "@/lib/server/web/rate-limit";

export const runtime = "nodejs";

/**
 * Starts a sign-up: mails a confirmation link (or, to an address with an account, a note saying
 * so). 202 with the same body either way, so the answer does not tell whether an address is taken.
 */
export const POST = publicRoute(async (request) => {
  const input = await readJson(request, signupSchema);
  return json(await requestSignup(input, addressOf(request)), 202);
});
