/**
 * Through the real server: a JSON answer smaller than the TCP initial window (10 segments of 1460
 * bytes, RFC 6928 §2) goes unzipped even to a client that accepts gzip, and says why
 * (`no-transform`, RFC 9111 §5.2.2.6); a larger one is gzipped. The threshold is a design choice
 * measured in issue "Speed" (lib/server/web/http.ts).
 */
import { expect, test } from "@playwright/test";
import { DEMO } from "./support/demo";
import { signIn } from "./support/session";

test("small JSON answers go unzipped, large ones gzipped", async ({ page }) => {
  const labId = await signIn(page, DEMO.modeller.email);
  const gzip = { "accept-encoding": "gzip" };

  const studies = await page.request.get(`/api/v1/labs/${labId}/studies`, { headers: gzip });
  expect(studies.status()).toBe(200);
  expect((await studies.body()).length).toBeLessThan(14_600);
  expect(studies.headers()["content-encoding"]).toBeUndefined();
  expect(studies.headers()["cache-control"]).toBe("no-store, no-transform");

  const refused = await page.request.get(`/api/v1/labs/${labId}/audit`, { headers: gzip }); // manager only
  expect(refused.status()).toBe(403);
  expect(refused.headers()["content-encoding"]).toBeUndefined();

  // A demo fit with its profiles and residuals is about 26 KB of JSON.
  const fits = (await (await page.request.get(`/api/v1/labs/${labId}/fits`)).json()) as { items: { id: string }[] };
  const fit = await page.request.get(`/api/v1/labs/${labId}/fits/${fits.items[0].id}`, { headers: gzip });
  expect(fit.status()).toBe(200);
  expect((await fit.body()).length).toBeGreaterThanOrEqual(14_600); // the body as sent, unzipped by the client
  expect(fit.headers()["content-encoding"]).toBe("gzip");
  expect(fit.headers()["cache-control"]).toBe("no-store");
});
