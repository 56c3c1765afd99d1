/**
 * The lab navigation holds its layout: one row at 1280 px and at 1024 px wide (the lab manager has
 * the most links, nine), and a Menu button that opens it below 768 px.
 */
import { expect, test } from "./pages/fixtures";
import type { DashboardPage } from "./pages/dashboard-page";

test.use({ role: "manager" });

/** How many rows the nav's links sit on: the number of distinct link tops (common practice, no source). */
async function rowsOf(dashboard: DashboardPage): Promise<number> {
  const tops = await dashboard.nav
    .getByRole("link")
    .evaluateAll((links) => links.map((l) => Math.round(l.getBoundingClientRect().top)));
  return new Set(tops).size;
}

for (const width of [1280, 1024]) {
  test(`at ${width}×800 the lab navigation is one row with every link`, async ({ lab, page }) => {
    await page.setViewportSize({ width, height: 800 });
    const dashboard = lab.dashboard();
    await dashboard.goto();
    expect(await dashboard.navLabels()).toEqual([
      "Dashboard",
      "Studies",
      "Readouts",
      "Kinetics",
      "Fits",
      "Runs",
      "Members",
      "Audit trail",
      "Mailbox (dev)",
    ]);
    expect(await rowsOf(dashboard)).toBe(1);
    // The nav's height is one link's height plus its padding: no second row hiding below.
    const nav = (await dashboard.nav.boundingBox())!;
    const link = (await dashboard.nav.getByRole("link").first().boundingBox())!;
    expect(nav.height).toBeLessThan(2 * link.height);
    // Nothing scrolls sideways.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
    await expect(dashboard.nav.getByRole("link", { name: "Dashboard" })).toHaveAttribute("aria-current", "page");
    await page.screenshot({ path: `test-results/nav-${width}.png` });
  });
}

test("below 768 px the navigation folds into a Menu button that opens it", async ({ lab, page }) => {
  await page.setViewportSize({ width: 600, height: 800 });
  const dashboard = lab.dashboard();
  await dashboard.goto();
  await expect(dashboard.nav).toBeHidden();
  await page.getByTestId("lab-nav-toggle").click();
  await expect(dashboard.nav).toBeVisible();
  await dashboard.nav.getByRole("link", { name: "Studies" }).click();
  await expect(page).toHaveURL(`/labs/${lab.labId}/studies`);
  await expect(dashboard.heading).toHaveText("Studies");
  await page.screenshot({ path: "test-results/nav-600.png" });
});
