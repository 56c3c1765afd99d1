/**
 * The front door of each web process (web-copy.ts): an API script's GET whose answer the lab's
 * list and detail routes keep (lib/server/web/answer-cache.ts says exactly when one is given
 * again) is answered here, before Next's server routes it; every other request goes on to Next.
 *
 * The answer is the one the route would give: its kept bytes and headers, the security headers
 * next.config.ts adds to every /api answer, and gzip where Next's compression would apply it
 * (an answer without `no-transform`, to a client that accepts gzip). It is given only for a URL
 * already in normal form (the form the route kept it under) and never for a request Next would
 * have to read further (anything but GET).
 *
 * Why: a kept answer given through Next still cost about 1.1 ms of CPU per request (routing, the
 * request and response as web streams, async context), most of the server's work under a polling
 * load; here it costs a database change-mark query and a write. Measured in issue "Speed"
 * (tests/bench/server-load.bench.ts).
 */
import type { IncomingMessage, OutgoingHttpHeaders, ServerResponse } from "node:http";
import { promisify } from "node:util";
import { gzip } from "node:zlib";
import { answerPath, keptAnswerLookup, type KeptAnswer } from "@/lib/web/kept-answers";
import { API_CSP, FIXED_SECURITY_HEADERS } from "@/lib/web/security-headers";

/** The only URLs whose answers routes keep (labReadRoute). */
const KEPT_PREFIX = "/api/v1/labs/";

/** The headers next.config.ts adds to every answer under /api. */
const SECURITY_HEADERS: OutgoingHttpHeaders = Object.fromEntries([
  ...FIXED_SECURITY_HEADERS.map((h) => [h.key.toLowerCase(), h.value]),
  ["content-security-policy", API_CSP],
]);

const gzipAsync = promisify(gzip);

/** Each kept body's gzipped bytes, made once at its first gzipped answer (a body is never changed). */
const gzipped = new WeakMap<Uint8Array, Promise<Buffer>>();

function gzipOf(body: Uint8Array): Promise<Buffer> {
  let zipped = gzipped.get(body);
  if (!zipped) gzipped.set(body, (zipped = gzipAsync(body)));
  return zipped;
}

/** The client accepts gzip: `gzip` among Accept-Encoding's codings without q=0. */
export function acceptsGzip(acceptEncoding: string | undefined): boolean {
  if (!acceptEncoding) return false;
  return acceptEncoding.split(",").some((part) => {
    const [coding, ...params] = part.split(";").map((s) => s.trim().toLowerCase());
    if (coding !== "gzip") return false;
    const q = params.find((p) => p.startsWith("q="));
    return q === undefined || Number(q.slice(2)) > 0;
  });
}

const routeHeader = (kept: KeptAnswer, name: string) =>
  kept.headers.find(([k]) => k.toLowerCase() === name)?.[1] ?? null;

/**
 * Answers `req` with its kept answer and resolves true, or resolves false without touching `res`
 * (nothing kept, not a kept kind of request, or a client whose codings only Next's compression
 * negotiates).
 */
export async function giveKeptAnswer(req: IncomingMessage, res: ServerResponse): Promise<boolean> {
  const url = req.url;
  const authorization = req.headers.authorization;
  if (req.method !== "GET" || !url?.startsWith(KEPT_PREFIX) || !authorization) return false;
  const acceptEncoding = req.headers["accept-encoding"];
  const gzipOk = acceptsGzip(acceptEncoding);
  // Only other codings (deflate, br): Next's compression chooses among them; leave it to Next.
  if (acceptEncoding && !gzipOk && !/^\s*identity\s*$/i.test(acceptEncoding)) return false;
  const lookup = keptAnswerLookup();
  if (!lookup || answerPath(url) !== url) return false;
  const kept = await lookup(authorization, url);
  if (!kept) return false;
  const compressible = !/\bno-transform\b/i.test(routeHeader(kept, "cache-control") ?? "");
  const zip = compressible && gzipOk;
  const body = zip ? await gzipOf(kept.body) : kept.body;
  const headers: OutgoingHttpHeaders = { ...Object.fromEntries(kept.headers), ...SECURITY_HEADERS };
  if (compressible) headers.vary = "Accept-Encoding";
  if (zip) headers["content-encoding"] = "gzip";
  headers["content-length"] = body.byteLength;
  res.writeHead(kept.status, headers);
  res.end(body);
  return true;
}
