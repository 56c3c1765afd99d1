import { AUDIT_SORTS, listAudit } from "@/lib/server/data/audit";
import { json } from "@/lib/server/http";
import { labRoute } from "@/lib/server/lab-route";
import { parseListQuery } from "@/lib/server/list";

export const runtime = "nodejs";

export const GET = labRoute("audit.read", async (ctx, request) =>
  json(await listAudit(ctx, parseListQuery(request.url, AUDIT_SORTS, "at", "desc"))),
);
