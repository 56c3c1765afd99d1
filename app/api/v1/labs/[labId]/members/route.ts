import { listMembers, MEMBER_SORTS } from "@/lib/server/data/members";
import { json } from "@/lib/server/http";
import { labRoute } from "@/lib/server/lab-route";
import { parseListQuery } from "@/lib/server/list";

export const runtime = "nodejs";

export const GET = labRoute("member.list", async (ctx, request) =>
  json(await listMembers(ctx, parseListQuery(request.url, MEMBER_SORTS, "email", "asc"))),
);
