/**
 * The front door of each web process (lib/cli/front-door.ts): a kept answer is given over HTTP before
 * the request reaches the routes, exactly as the route keeps it (same bytes, its headers, the
 * API's security headers), and never when the route would answer otherwise: another token, a write
 * since, a revoked token, another method, a URL not in normal form. Here a node:http server puts
 * the front door before the app's own route handlers (what Next would route to); every expected
 * body is the route's own answer or a value written by the test (common practice, no source).
 */
import {
  createServer,
  get as httpGet,
  request as httpRequest,
  type IncomingHttpHeaders,
  type IncomingMessage,
  type Server,
  type ServerResponse,
} from "node:http";
import type { AddressInfo } from "node:net";
import { gunzipSync } from "node:zlib";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { acceptsGzip, giveKeptAnswer } from "@/lib/cli/front-door";
import { stopJobs } from "@/lib/server/jobs/worker";
import { database } from "@/lib/server/services";
import { labAnswers } from "@/lib/server/web/lab-route";
import { KEPT_ANSWERS, keptAnswerLookup, offerKeptAnswers, type KeptAnswerLookup } from "@/lib/web/kept-answers";
import { API_CSP, FIXED_SECURITY_HEADERS } from "@/lib/web/security-headers";
import { discoverRoutes } from "../support/api";
import { setupLabApi } from "../support/lab-api";

/** PostgreSQL has no change mark: no answer is kept there, so the door gives none and the route makes each. */
const keeping = process.env.MORPHOKIN_TEST_DB !== "postgres";

/** A server with the front door before `routes`, which counts the requests that reach it. */
async function serve(routes: (req: IncomingMessage, res: ServerResponse) => Promise<void>) {
  const reached = { count: 0 };
  const server: Server = createServer((req, res) => {
    void giveKeptAnswer(req, res).then(async (given) => {
      if (given) return;
      reached.count++;
      await routes(req, res);
    });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return { base, reached, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

/** A GET by node:http (fetch adds an Accept-Encoding of its own and unzips); the body as sent. */
function get(url: string, headers: Record<string, string>) {
  return new Promise<{ status: number; headers: IncomingHttpHeaders; body: Buffer }>((resolve, reject) => {
    httpGet(url, { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on("error", reject);
    }).on("error", reject);
  });
}

describe("the front door with a lookup of its own", () => {
  let saved: KeptAnswerLookup | null = null;
  let asked: [string, string][] = [];
  const body = new TextEncoder().encode(JSON.stringify({ items: Array.from({ length: 2000 }, (_, i) => ({ i })) }));
  const kept = (cacheControl: string) => ({
    status: 200,
    headers: [
      ["cache-control", cacheControl],
      ["content-type", "application/json"],
    ] as [string, string][],
    body,
  });
  let door: Awaited<ReturnType<typeof serve>>;
  let cacheControl = "no-store";
  beforeAll(async () => {
    saved = keptAnswerLookup();
    offerKeptAnswers(async (authorization, pathAndQuery) => {
      asked.push([authorization, pathAndQuery]);
      return pathAndQuery.startsWith("/api/v1/labs/kept") ? kept(cacheControl) : null;
    });
    door = await serve(async (_req, res) => void res.writeHead(299).end("routed"));
  });
  afterAll(async () => {
    await door.close();
    (globalThis as { [KEPT_ANSWERS]?: KeptAnswerLookup | null })[KEPT_ANSWERS] = saved;
  });
  afterEach(() => {
    asked = [];
    cacheControl = "no-store";
  });
  const token = { authorization: "Bearer t-1" };

  it("gives the kept bytes with the route's headers and the API's security headers", async () => {
    const r = await get(`${door.base}/api/v1/labs/kept/studies?sort=name`, { ...token, "accept-encoding": "identity" });
    expect(r.status).toBe(200);
    expect(r.body.equals(Buffer.from(body))).toBe(true);
    expect(r.headers["content-type"]).toBe("application/json");
    expect(r.headers["cache-control"]).toBe("no-store");
    expect(r.headers["content-security-policy"]).toBe(API_CSP);
    for (const h of FIXED_SECURITY_HEADERS) expect(r.headers[h.key.toLowerCase()]).toBe(h.value);
    expect(asked).toEqual([["Bearer t-1", "/api/v1/labs/kept/studies?sort=name"]]);
    expect(door.reached.count).toBe(0);
  });

  it("gzips what Next's compression would gzip, once per kept answer, and nothing marked no-transform", async () => {
    const zipped = await get(`${door.base}/api/v1/labs/kept/audit`, { ...token, "accept-encoding": "br;q=0, gzip" });
    expect(zipped.headers["content-encoding"]).toBe("gzip");
    expect(zipped.headers.vary).toBe("Accept-Encoding");
    expect(gunzipSync(zipped.body).equals(Buffer.from(body))).toBe(true);
    cacheControl = "no-store, no-transform";
    const plain = await get(`${door.base}/api/v1/labs/kept/audit`, { ...token, "accept-encoding": "gzip" });
    expect(plain.headers["content-encoding"]).toBeUndefined();
    expect(plain.body.equals(Buffer.from(body))).toBe(true);
    expect(door.reached.count).toBe(0);
  });

  it("leaves to Next what it does not keep or cannot answer as Next would", async () => {
    // node:http with a path sends it as written (fetch, or a URL string, would normalise "x/../kept" first).
    const routed = (path: string, headers: Record<string, string>, method = "GET") =>
      new Promise<number>((resolve, reject) => {
        const before = door.reached.count;
        const { hostname, port } = new URL(door.base);
        const req = httpRequest({ hostname, port, path, method, headers }, (res) => {
          let text = "";
          res.on("data", (c: Buffer) => (text += c.toString()));
          res.on("end", () => resolve(text === "routed" ? door.reached.count - before : -1));
        });
        req.on("error", reject);
        req.end();
      });
    expect(await routed("/api/v1/labs/not-kept/studies", token)).toBe(1); // the lookup has none
    expect(await routed("/api/v1/labs/kept/studies", {})).toBe(1); // no token: a browser's session
    expect(await routed("/api/v1/labs/kept/studies", token, "POST")).toBe(1);
    expect(await routed("/api/v1/me", token)).toBe(1); // not a lab's list or detail
    expect(await routed("/api/v1/labs/x/../kept/studies", token)).toBe(1); // not in normal form
    expect(await routed("/api/v1/labs/kept/studies", { ...token, "accept-encoding": "deflate" })).toBe(1); // Next negotiates
    expect(asked.map(([, p]) => p)).toEqual(["/api/v1/labs/not-kept/studies"]); // the only one looked up
  });

  it("reads Accept-Encoding's codings and their weights", () => {
    // RFC 9110 §12.5.3 (Accept-Encoding, qvalues): from memory.
    expect(acceptsGzip("gzip")).toBe(true);
    expect(acceptsGzip("gzip, deflate, br")).toBe(true);
    expect(acceptsGzip("br;q=1.0, GZIP;q=0.5")).toBe(true);
    expect(acceptsGzip("gzip;q=0")).toBe(false);
    expect(acceptsGzip("deflate")).toBe(false);
    expect(acceptsGzip(undefined)).toBe(false);
  });
});

describe("the front door before the app's routes", () => {
  const lab = setupLabApi({ setup: async () => void (await stopJobs()) }); // no heartbeat writes between calls
  let door: Awaited<ReturnType<typeof serve>>;
  beforeAll(async () => {
    // What Next would do: the route of the URL, called with the request as sent.
    const table = [...(await discoverRoutes())]
      .filter(([key]) => key.startsWith("GET "))
      .map(([key, handler]) => {
        const names: string[] = [];
        const pattern = key.slice(4).replace(/\[(\w+)\]/g, (_, name: string) => (names.push(name), "([^/]+)"));
        return { re: new RegExp(`^${pattern}$`), names, handler };
      });
    door = await serve(async (req, res) => {
      const url = new URL(req.url!, "http://127.0.0.1");
      const hit = table.map((r) => ({ r, m: r.re.exec(url.pathname) })).find((x) => x.m);
      if (!hit) return void res.writeHead(404).end();
      const params = Object.fromEntries(hit.r.names.map((n, i) => [n, hit.m![i + 1]]));
      const headers = Object.fromEntries(
        Object.entries(req.headers).filter(([, v]) => typeof v === "string"),
      ) as Record<string, string>;
      const answer = await hit.r.handler(new Request(`http://127.0.0.1${req.url}`, { headers }), {
        params: Promise.resolve(params),
      });
      res.writeHead(answer.status, Object.fromEntries(answer.headers));
      res.end(Buffer.from(await answer.arrayBuffer()));
    });
  });
  afterAll(() => door.close());

  const studiesOf = (who: "scientist" | "manager" | "collaborator") => {
    const url = `${door.base}/api/v1/labs/${lab.w.labId}/studies?sort=name&order=asc`;
    return get(url, { authorization: `Bearer ${lab.w.people[who].token}` });
  };
  const names = (r: { body: Buffer }) =>
    (JSON.parse(r.body.toString()) as { items: { name: string }[] }).items.map((s) => s.name);

  it("gives a token's answer again without the route, until anything is written", async () => {
    await studiesOf("scientist"); // the token's lastUsedAt, due once a minute, is written by the first call
    const first = await studiesOf("scientist");
    const reached = door.reached.count;
    const given = labAnswers().counts.given;
    const second = await studiesOf("scientist");
    expect(second.body.equals(first.body)).toBe(true);
    if (keeping) expect(second.headers["content-security-policy"]).toBe(API_CSP); // (the test's routes add none)
    // Answered at the door; on PostgreSQL (no change mark) every answer is made by the route.
    expect(door.reached.count).toBe(keeping ? reached : reached + 1);
    expect(labAnswers().counts.given).toBe(keeping ? given + 1 : given);

    const created = await lab.api("POST", "/api/v1/labs/[labId]/studies", {
      json: { name: "Front door study", tissue: "dorsal skin", organism: "invented newt" },
    });
    expect(created.status).toBe(201);
    const after = await studiesOf("scientist");
    expect(names(after)).toContain("Front door study");
    expect(door.reached.count).toBe(keeping ? reached + 1 : reached + 2); // made again by the route
  });

  it("never gives one token's answer to another, nor to a revoked token", async () => {
    // The first call of each token writes its lastUsedAt (once a minute); the second is kept.
    for (let i = 0; i < 2; i++) for (const who of ["manager", "collaborator"] as const) await studiesOf(who);
    const reached = door.reached.count;
    const mine = await studiesOf("manager");
    const theirs = await studiesOf("collaborator");
    expect([mine.status, theirs.status]).toEqual([200, 200]);
    expect(door.reached.count).toBe(keeping ? reached : reached + 2); // each given its own token's kept answer

    const m = await database();
    const where = { where: { userId: lab.w.people.collaborator.actor.userId } };
    await m.ApiToken.update({ revokedAt: new Date() }, where);
    try {
      const revoked = await studiesOf("collaborator");
      expect(revoked.status).toBe(401);
      expect(door.reached.count).toBe(keeping ? reached + 1 : reached + 3);
    } finally {
      await m.ApiToken.update({ revokedAt: null }, where);
    }
  });
});
