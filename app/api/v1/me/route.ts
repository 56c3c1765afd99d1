import { settingsSchema } from "@/lib/contracts/account";
import { getMe, updateSettings } from "@/lib/server/accounts/accounts";
import { json, readJson } from "@/lib/server/web/http";
import { userRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

export const GET = userRoute(async (actor) => json(await getMe(actor)));

export const PATCH = userRoute(async (actor, request) =>
  json(await updateSettings(actor, await readJson(request, settingsSchema))),
);
