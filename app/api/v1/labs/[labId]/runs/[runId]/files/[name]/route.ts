import { Readable } from "node:stream";
import { openRunFile } from "@/lib/server/runs/runs";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** A stored output of a finished run: final-<s>.f64/.png, snapshot-<i>-<s>.png, spectrum.json, fft.png, preview.png, result.json, run.json. */
export const GET = labRoute<{ labId: string; runId: string; name: string }>("lab.read", async (ctx, _request, p) => {
  const f = await openRunFile(ctx, p.runId, p.name);
  return new Response(Readable.toWeb(f.body as Readable) as ReadableStream, {
    headers: {
      "content-type": f.contentType,
      ...(f.contentLength !== undefined ? { "content-length": String(f.contentLength) } : {}),
      // A finished run is immutable, so its files never change.
      "cache-control": "private, max-age=31536000, immutable",
    },
  });
});
