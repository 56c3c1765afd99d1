import { labCreateSchema } from "@/lib/contracts/lab";
import { createLab, getMe } from "@/lib/server/accounts/accounts";
import { json, readJson } from "@/lib/server/web/http";
import { userRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** The labs the caller belongs to, with their role in each. */
export const GET = userRoute(async (actor) => json({ items: (await getMe(actor)).labs }));

export const POST = userRoute(async (actor, request) => {
  const { name } = await readJson(request, labCreateSchema);
  return json(await createLab(actor, name), 201);
});
