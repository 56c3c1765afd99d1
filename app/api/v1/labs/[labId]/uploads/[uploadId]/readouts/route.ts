import { listReadouts, READOUT_SORTS, startReadout } from "@/lib/server/readouts/readouts";
import { json, readJsonValue } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

type P = { labId: string; uploadId: string };

/** Every readout of one upload, newest first (old ones stay: readouts are immutable). */
export const GET = labReadRoute<P>("upload.read", async (ctx, request, p) =>
  json(
    await listReadouts(ctx, { uploadId: p.uploadId }, parseListQuery(request.url, READOUT_SORTS, "createdAt", "desc")),
  ),
);

/**
 * Starts a new readout as a background job (202). JSON body, all optional — images: `roi`
 * ({kind:"rect",x,y,width,height} or {kind:"polygon",points}), `channel`, `invert`, `flatten`,
 * `window`, `profileAxis`, `pixelSizeUm`; tables: `columns` {x,y | position | spacing}, `unit`, `pixelSizeUm`.
 */
export const POST = labRoute<P>("readout.create", async (ctx, request, p) => {
  return json(await startReadout(ctx, p.uploadId, await readJsonValue(request)), 202);
});
