import { listMembers, MEMBER_SORTS } from "@/lib/server/labs/members";
import { json } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

export const GET = labRoute("member.list", async (ctx, request) =>
  json(await listMembers(ctx, parseListQuery(request.url, MEMBER_SORTS, "email", "asc"))),
);
