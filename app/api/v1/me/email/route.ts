import { emailChangeSchema } from "@/lib/contracts/account";
import { requestEmailChange } from "@/lib/server/accounts/profile";
import { json, readJson } from "@/lib/server/web/http";
import { userRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Asks to change the account's e-mail (current password required): a link goes to the new address. */
export const POST = userRoute(async (actor, request) =>
  json(await requestEmailChange(actor, await readJson(request, emailChangeSchema)), 202),
);
