import { getReadout } from "@/lib/server/readouts/readouts";
import { json } from "@/lib/server/web/http";
import { labReadRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** One readout: status and progress while it runs, then every number, its settings and links to the derived products. */
export const GET = labReadRoute<{ labId: string; readoutId: string }>("upload.read", async (ctx, _request, p) =>
  json(await getReadout(ctx, p.readoutId)),
);
