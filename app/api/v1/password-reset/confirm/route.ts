import { passwordResetSchema } from "@/lib/contracts/account";
import { resetPassword } from "@/lib/server/accounts/password-reset";
import { json, readJson } from "@/lib/server/web/http";
import { publicRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** The e-mailed reset link's token and the new password: sets it once and signs the account out everywhere. */
export const POST = publicRoute(async (request) => {
  const { token, newPassword } = await readJson(request, passwordResetSchema);
  return json(await resetPassword(token, newPassword));
});
