import { passwordResetRequestSchema } from "@/lib/contracts/account";
import { requestPasswordReset } from "@/lib/server/accounts/password-reset";
import { json, readJson } from "@/lib/server/web/http";
import { publicRoute } from "@/lib/server/web/lab-route";
import { addressOf } from "@/lib/server/web/rate-limit";

export const runtime = "nodejs";

/** "Forgot your password?": 202 with the same body for every address; a link goes only to an account. */
export const POST = publicRoute(async (request) => {
  const { email } = await readJson(request, passwordResetRequestSchema);
  return json(await requestPasswordReset(email, addressOf(request)), 202);
});
