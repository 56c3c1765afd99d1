import { listKineticsVersions } from "@/lib/server/kinetics/kinetics";
import { json } from "@/lib/server/web/http";
import { labReadRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Every version, newest first, with its definition. */
export const GET = labReadRoute<{ labId: string; kineticsId: string }>("lab.read", async (ctx, _request, p) =>
  json({ items: await listKineticsVersions(ctx, p.kineticsId) }),
);
