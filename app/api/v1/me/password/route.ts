import { changePasswordSchema } from "@/lib/contracts/account";
import { currentSessionId } from "@/lib/server/accounts/actor";
import { changePassword } from "@/lib/server/accounts/accounts";
import { json, readJson } from "@/lib/server/web/http";
import { userRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Changes the password (current one required) and ends the account's other sessions. */
export const POST = userRoute(async (actor, request) => {
  const input = await readJson(request, changePasswordSchema);
  return json(await changePassword(actor, input, await currentSessionId(request)));
});
