/**
 * Security headers on pages, API answers and downloads, and the main pages load under the CSP with
 * no violation. Header values: the product's policy in lib/web/security-headers.ts, written out
 * here on purpose; directive meanings: CSP Level 3 (W3C), OWASP Secure Headers Project.
 */
import { expect, test, type Page, type Response } from "@playwright/test";
import { DEMO } from "./support/demo";
import { signIn } from "./support/session";

const FIXED = {
  "x-frame-options": "DENY",
  "x-content-type-options": "nosniff",
  "referrer-policy": "strict-origin-when-cross-origin",
};

function expectFixedHeaders(res: Response | null, what: string) {
  expect(res, what).not.toBeNull();
  const h = res!.headers();
  for (const [k, v] of Object.entries(FIXED)) expect(h[k], `${what}: ${k}`).toBe(v);
  expect(h["permissions-policy"], `${what}: permissions-policy`).toContain("camera=()");
  expect(h["permissions-policy"]).toContain("microphone=()");
  expect(h["permissions-policy"]).toContain("geolocation=()");
  expect(h["content-security-policy"], `${what}: content-security-policy`).toContain("frame-ancestors 'none'");
}

/** Records every CSP violation the page reports, as console errors and as DOM events. */
function watchCsp(page: Page): string[] {
  const seen: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error" && /Content Security Policy/i.test(m.text())) seen.push(`${page.url()}: ${m.text()}`);
  });
  void page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) =>
      console.error(`Content Security Policy violation event: ${e.violatedDirective} ${e.blockedURI}`),
    );
  });
  return seen;
}

test("pages, API answers and downloads carry the security headers", async ({ page }) => {
  const landing = await page.goto("/");
  expectFixedHeaders(landing, "landing page");
  const csp = landing!.headers()["content-security-policy"];
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'(;|$)/);
  expect(csp).not.toContain("unsafe-eval");
  const again = await page.goto("/");
  expect(again!.headers()["content-security-policy"]).not.toBe(csp); // a fresh nonce per response

  const labId = await signIn(page, DEMO.scientist.email);
  const api = await page.request.get(`/api/v1/labs/${labId}/studies`);
  expectFixedHeaders(api as unknown as Response, "API answer");
  expect(api.headers()["content-security-policy"]).toContain("default-src 'none'");

  const studies = await (await page.request.get(`/api/v1/labs/${labId}/studies?sort=name&dir=asc`)).json();
  const study = studies.items.find((s: { name: string }) => s.name.startsWith("Dorsal placode"));
  const specimens = await (
    await page.request.get(`/api/v1/labs/${labId}/studies/${study.id}/specimens?sort=label&dir=asc`)
  ).json();
  const uploads = await (
    await page.request.get(`/api/v1/labs/${labId}/specimens/${specimens.items[0].id}/uploads`)
  ).json();
  const download = await page.request.get(`/api/v1/labs/${labId}/uploads/${uploads.items[0].id}/content`);
  expect(download.status()).toBe(200);
  expectFixedHeaders(download as unknown as Response, "original download");
  expect(download.headers()["content-disposition"]).toMatch(/^attachment; /);
  expect(download.headers()["content-type"]).toBe("image/tiff");
});

test("the main pages load with no CSP violation", async ({ page }) => {
  test.setTimeout(120_000);
  const violations = watchCsp(page);
  await page.goto("/");
  await page.goto("/login");
  const labId = await signIn(page, DEMO.modeller.email);
  const get = async (path: string) =>
    (await (await page.request.get(path)).json()) as { items: { id: string; name?: string; status?: string }[] };

  const studies = await get(`/api/v1/labs/${labId}/studies?sort=name&dir=asc`);
  const placodes = studies.items.find((s) => s.name?.startsWith("Dorsal placode"))!;
  const specimens = await get(`/api/v1/labs/${labId}/studies/${placodes.id}/specimens?sort=label&dir=asc`);
  const readouts = await get(`/api/v1/labs/${labId}/readouts`);
  const fits = await get(`/api/v1/labs/${labId}/fits`);
  const runs = await get(`/api/v1/labs/${labId}/runs`);

  const pages: [string, string][] = [
    ["dashboard", `/labs/${labId}`],
    ["studies", `/labs/${labId}/studies`],
    ["a study", `/labs/${labId}/studies/${placodes.id}`],
    ["a specimen with an image", `/labs/${labId}/specimens/${specimens.items[0].id}`],
    ["readouts", `/labs/${labId}/readouts`],
    ["a readout", `/labs/${labId}/readouts/${readouts.items.find((r) => r.status === "succeeded")!.id}`],
    ["kinetics", `/labs/${labId}/kinetics`],
    ["kinetics with charts", `/labs/${labId}/kinetics/schnakenberg`],
    ["fits", `/labs/${labId}/fits`],
    ["a fit", `/labs/${labId}/fits/${fits.items[0].id}`],
    ["runs", `/labs/${labId}/runs`],
    ["a run", `/labs/${labId}/runs/${runs.items[0].id}`],
    ["account", "/account"],
  ];
  for (const [what, path] of pages) {
    const res = await page.goto(path);
    expect(res?.status(), what).toBe(200);
    expect(res!.headers()["content-security-policy"], what).toContain("'nonce-");
    await page.waitForLoadState("networkidle");
  }
  // The kinetics page draws its charts on the client: they appear only if its scripts ran.
  await page.goto(`/labs/${labId}/kinetics/schnakenberg`);
  await expect(page.getByTestId("dispersion-plot")).toBeVisible();
  expect(violations).toEqual([]);
});
