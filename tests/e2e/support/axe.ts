/**
 * The accessibility check of one page: axe-core (Deque's engine, through @axe-core/playwright) with
 * the WCAG 2.1 A/AA rules and axe's best practices (landmarks, heading order), failing on any
 * "serious" or "critical" finding. The message names each rule, what it asks and where it failed.
 */
import AxeBuilder from "@axe-core/playwright";
import { expect, type Page } from "@playwright/test";

/** axe's impact levels that fail the check (the brief: serious and critical; axe's own scale). */
const FAILING = new Set(["serious", "critical"]);

/** Waits until the page's tables and panels have loaded, so axe sees what a person sees. */
export async function settle(page: Page) {
  await expect(page.getByRole("heading", { level: 1 }).first()).toBeVisible();
  await expect(page.getByTestId("page-skeleton")).toHaveCount(0);
  await page.waitForLoadState("networkidle", { timeout: 5_000 }).catch(() => undefined);
  await expect(page.locator("[aria-busy=true]")).toHaveCount(0);
}

export async function expectNoSeriousViolations(page: Page) {
  await settle(page);
  const result = await new AxeBuilder({ page })
    .withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "best-practice"])
    .analyze();
  const failing = result.violations.filter((v) => FAILING.has(v.impact ?? ""));
  const report = failing.map(
    (v) =>
      `${v.impact} ${v.id}: ${v.help}\n` +
      v.nodes
        .slice(0, 5)
        .map((n) => `    at ${n.target.join(" ")} — ${n.failureSummary?.replace(/\s+/g, " ")}`)
        .join("\n"),
  );
  expect(report, `accessibility violations on ${new URL(page.url()).pathname}`).toEqual([]);
}
