import { json } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

export const GET = labRoute("lab.read", async (ctx) => json({ id: ctx.labId, name: ctx.labName, role: ctx.role }));
