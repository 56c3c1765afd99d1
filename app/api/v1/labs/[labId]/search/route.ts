import { parseSearchQuery, searchLab } from "@/lib/server/search/search";
import { json } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

export const GET = labRoute("lab.read", async (ctx, request) =>
  json(await searchLab(ctx, parseSearchQuery(request.url))),
);
