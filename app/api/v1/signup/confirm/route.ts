import { signupConfirmSchema } from "@/lib/contracts/account";
import { confirmSignup } from "@/lib/server/accounts/accounts";
import { json, readJson } from "@/lib/server/web/http";
import { publicRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** The e-mailed confirmation link's token plus the password chosen at sign-up: creates the account and its lab. */
export const POST = publicRoute(async (request) => {
  const { token, password } = await readJson(request, signupConfirmSchema);
  return json(await confirmSignup(token, password), 201);
});
