import { tokenCreateSchema } from "@/lib/contracts/account";
import { createToken, listTokens } from "@/lib/server/accounts/tokens";
import { json, readJson } from "@/lib/server/web/http";
import { userRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

export const GET = userRoute(async (actor) => json({ items: await listTokens(actor) }));

/** The response holds `secret` once; only its hash is kept. `expiresInDays`: 30, 90 (default) or 365. */
export const POST = userRoute(async (actor, request) => {
  const body = await readJson(request, tokenCreateSchema);
  return json(await createToken(actor, body.name, body.expiresInDays), 201);
});
