import { tokenCreateSchema } from "@/lib/contracts/account";
import { createToken, listTokens } from "@/lib/server/data/tokens";
import { json, readJson } from "@/lib/server/http";
import { userRoute } from "@/lib/server/lab-route";

export const runtime = "nodejs";

export const GET = userRoute(async (actor) => json({ items: await listTokens(actor) }));

/** The response holds `secret` once; only its hash is kept. */
export const POST = userRoute(async (actor, request) => json(await createToken(actor, (await readJson(request, tokenCreateSchema)).name), 201));
