import { emailChangeConfirmSchema } from "@/lib/contracts/account";
import { confirmEmailChange } from "@/lib/server/accounts/profile";
import { json, readJson } from "@/lib/server/web/http";
import { publicRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** The link mailed to the new address: makes it the account's address, once. */
export const POST = publicRoute(async (request) => {
  const { token } = await readJson(request, emailChangeConfirmSchema);
  return json(await confirmEmailChange(token));
});
