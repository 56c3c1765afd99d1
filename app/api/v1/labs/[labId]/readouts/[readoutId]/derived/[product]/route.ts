import { Readable } from "node:stream";
import { openDerived } from "@/lib/server/readouts/readouts";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** A stored derived product of a finished image readout: spectrum.json, preview.png or fft.png. */
export const GET = labRoute<{ labId: string; readoutId: string; product: string }>(
  "upload.read",
  async (ctx, _request, p) => {
    const d = await openDerived(ctx, p.readoutId, p.product);
    return new Response(Readable.toWeb(d.body as Readable) as ReadableStream, {
      headers: {
        "content-type": d.contentType,
        ...(d.contentLength !== undefined ? { "content-length": String(d.contentLength) } : {}),
        // A readout is immutable, so its products never change.
        "cache-control": "private, max-age=31536000, immutable",
      },
    });
  },
);
