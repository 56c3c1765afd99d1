/**
 * An accessibility check of every page, signed out and signed in as the lab manager (who may open
 * them all), on the seeded demo lab: axe-core finds no "serious" or "critical" violation of WCAG
 * 2.1 A/AA or of axe's best practices (tests/e2e/support/axe.ts).
 */
import type { APIRequestContext } from "@playwright/test";
import { expect, test } from "./pages/fixtures";
import { expectNoSeriousViolations } from "./support/axe";

/** The first item's id of an API list (the lab's own routes, read with the signed-in session). */
async function firstId(request: APIRequestContext, path: string): Promise<string> {
  const res = await request.get(`/api/v1/labs/${path}?pageSize=1`);
  expect(res.status(), path).toBe(200);
  const body = (await res.json()) as { items: { id: string }[] };
  expect(body.items.length, `the demo lab has no ${path}`).toBeGreaterThan(0);
  return body.items[0].id;
}

test.describe("signed out", () => {
  for (const path of ["/", "/login", "/signup"]) {
    test(`${path} has no serious accessibility violation`, async ({ page }) => {
      await page.goto(path);
      await expectNoSeriousViolations(page);
    });
  }
});

test.describe("signed in as the lab manager", () => {
  test.use({ role: "manager" });

  /** Each page by a name for the report and the way to its path (ids read from the lab's API). */
  const pages: [string, (r: APIRequestContext, lab: string) => Promise<string>][] = [
    ["overview", async () => ""],
    ["studies", async () => "/studies"],
    ["a study", async (r, lab) => `/studies/${await firstId(r, `${lab}/studies`)}`],
    [
      "a specimen (its uploads)",
      async (r, lab) =>
        `/specimens/${await firstId(r, `${lab}/studies/${await firstId(r, `${lab}/studies`)}/specimens`)}`,
    ],
    ["readouts", async () => "/readouts"],
    ["a readout", async (r, lab) => `/readouts/${await firstId(r, `${lab}/readouts`)}`],
    ["kinetics list", async () => "/kinetics"],
    ["a catalogue kinetics", async () => "/kinetics/schnakenberg"],
    ["new kinetics", async () => "/kinetics/new"],
    ["fits", async () => "/fits"],
    ["a fit", async (r, lab) => `/fits/${await firstId(r, `${lab}/fits`)}`],
    ["the fit builder", async () => "/fits/new"],
    ["runs", async () => "/runs"],
    ["a run", async (r, lab) => `/runs/${await firstId(r, `${lab}/runs`)}`],
    ["a new run", async () => "/runs/new"],
    ["batches", async () => "/batches"],
    ["members", async () => "/members"],
    ["audit trail", async () => "/audit"],
    ["mailbox", async () => "/mailbox"],
  ];

  for (const [name, pathOf] of pages) {
    test(`${name} has no serious accessibility violation`, async ({ lab, page }) => {
      // A fit's page draws several charts and a Turing-space map; axe reads every node of them.
      test.setTimeout(120_000);
      const sub = await pathOf(page.request, lab.labId);
      expect((await page.goto(`/labs/${lab.labId}${sub}`))?.status()).toBe(200);
      await expectNoSeriousViolations(page);
    });
  }

  test("account has no serious accessibility violation", async ({ lab, page }) => {
    await lab.account().goto();
    await expectNoSeriousViolations(page);
  });
});
