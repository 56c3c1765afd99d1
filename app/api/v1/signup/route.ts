import { signupSchema } from "@/lib/contracts/account";
import { signUp } from "@/lib/server/data/accounts";
import { json, readJson } from "@/lib/server/http";
import { publicRoute } from "@/lib/server/lab-route";

export const runtime = "nodejs";

/** Creates an account and its lab, with the new user as lab manager. */
export const POST = publicRoute(async (request) => {
  const input = await readJson(request, signupSchema);
  return json(await signUp(input), 201);
});
