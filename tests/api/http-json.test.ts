/**
 * JSON answers: never stored (`no-store`), and below the TCP initial window (10 segments of 1460
 * bytes, RFC 6928 §2) also `no-transform` (RFC 9111 §5.2.2.6), which Next's compression obeys: a
 * small answer goes unzipped. The byte count is UTF-8 bytes, not characters (RFC 8259 §8.1: JSON
 * text exchanged between systems is UTF-8). The threshold itself is a design choice measured in
 * issue "Speed" (the server under load).
 */
import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/server/errors";
import { errorResponse, GZIP_JSON_FROM_BYTES, json } from "@/lib/server/web/http";

const cacheControl = (res: Response) => res.headers.get("cache-control");

describe("json()", () => {
  it("answers JSON that no cache keeps, with the status asked for", async () => {
    const res = json({ items: [{ id: "a", name: "Dorsal rows" }], total: 1 }, 201);
    expect(res.status).toBe(201);
    expect(res.headers.get("content-type")).toBe("application/json");
    expect(await res.json()).toEqual({ items: [{ id: "a", name: "Dorsal rows" }], total: 1 });
  });

  it("keeps a small answer from being gzipped and lets a large one be", () => {
    expect(GZIP_JSON_FROM_BYTES).toBe(10 * 1460); // RFC 6928 §2: 10 segments of 1460 bytes
    expect(cacheControl(json({ id: "a" }))).toBe("no-store, no-transform");
    // {"s":"…"} is 8 bytes around the text: one byte under the threshold, then exactly at it.
    expect(cacheControl(json({ s: "x".repeat(GZIP_JSON_FROM_BYTES - 9) }))).toBe("no-store, no-transform");
    expect(cacheControl(json({ s: "x".repeat(GZIP_JSON_FROM_BYTES - 8) }))).toBe("no-store");
  });

  it("counts UTF-8 bytes, not characters", () => {
    // "µ" is 2 bytes in UTF-8: 7400 of them are 14 800 bytes in 7400 characters.
    const text = "µ".repeat(7400);
    expect(text.length).toBeLessThan(GZIP_JSON_FROM_BYTES);
    expect(cacheControl(json({ s: text }))).toBe("no-store");
  });
});

describe("errorResponse()", () => {
  it("answers errors the same way, keeping their own headers", async () => {
    const res = errorResponse(
      Object.assign(new AppError("rate_limited", "too many sign-in attempts"), { retryAfterS: 60 }),
    );
    expect(res.status).toBe(429);
    expect(res.headers.get("retry-after")).toBe("60");
    expect(res.headers.get("content-type")).toBe("application/json");
    expect(cacheControl(res)).toBe("no-store, no-transform");
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe("rate_limited");
  });
});
