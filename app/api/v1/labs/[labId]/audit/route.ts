import { AUDIT_SORTS, listAudit } from "@/lib/server/audit";
import { json } from "@/lib/server/web/http";
import { labReadRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

export const GET = labReadRoute("audit.read", async (ctx, request) =>
  json(await listAudit(ctx, parseListQuery(request.url, AUDIT_SORTS, "at", "desc"))),
);
