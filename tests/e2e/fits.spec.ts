/**
 * The modeller fits Schnakenberg to the seeded placode readouts (control vs inhibitor, γ free per
 * condition), waits for the job, and sees parameters with intervals and the verdict; a
 * collaborator opens the fit and comments, but is offered neither "New fit" nor "Re-run".
 */
import { expect, test } from "@playwright/test";
import { DEMO, unique } from "./support/demo";
import { signIn } from "./support/session";

test("modeller fits the placode readouts; a collaborator reads and comments", async ({ page, browser }) => {
  test.setTimeout(120_000);
  const labId = await signIn(page, DEMO.modeller.email);
  await page.goto(`/labs/${labId}/fits`);
  await page.getByTestId("new-fit").click();
  for (const s of ["DS-01", "DS-02", "DS-03", "DS-04"]) await page.getByTestId(`pick-${s}`).check();
  await expect(page.getByTestId("model-0-kinetics")).toHaveValue("schnakenberg");
  // ℓ = 40 µm puts Schnakenberg's 2π/k* near the seeded ~40–50 µm spacing for γ ≈ 100–200 (from memory of the dispersion at a = 0.1, b = 0.9, d = 20).
  await page.getByTestId("model-0-length-scale").fill("40");
  await page.getByTestId("mode-gamma").selectOption("per-condition");
  await page.getByTestId("start-gamma").fill("100");
  await page.getByTestId("lower-gamma").fill("10");
  await page.getByTestId("upper-gamma").fill("1000");
  const name = unique("Placodes control vs inhibitor");
  await page.getByTestId("fit-name").fill(name);
  await page.getByTestId("start-fit").click();
  await expect(page).toHaveURL(/\/fits\/[0-9a-f-]{36}$/);
  await expect(page.getByTestId("fit-caution")).toContainText("hypothesis");

  await expect(page.getByTestId("fit-verdict")).toBeVisible({ timeout: 90_000 });
  const table = page.getByTestId("parameters-table");
  await expect(table.getByTestId("fitted-gamma[control]")).toBeVisible();
  await expect(table.getByTestId("fitted-gamma[inhibitor 5 µM]")).toBeVisible();
  await expect(page.getByTestId("interval-gamma[control]")).toContainText("…");
  await expect(page.getByTestId("fit-verdict")).toContainText(/Turing|uncertaint/);
  await expect(page.getByTestId("predicted-measured")).toBeVisible();
  await expect(page.getByTestId("residuals-table")).toContainText("µm");
  await expect(page.getByTestId("rerun-fit")).toBeVisible();
  await expect(page.getByTestId("fit-map-figure")).toBeVisible({ timeout: 30_000 });
  if (process.env.FIT_SCREENSHOT) await page.screenshot({ path: process.env.FIT_SCREENSHOT, fullPage: true });
  const fitUrl = page.url();

  const ctx = await browser.newContext();
  const collab = await ctx.newPage();
  await signIn(collab, DEMO.collaborator.email);
  await collab.goto(`/labs/${labId}/fits`);
  await expect(collab.getByTestId("fits-table").getByRole("link", { name })).toBeVisible();
  await expect(collab.getByTestId("new-fit")).toHaveCount(0);
  await collab.goto(fitUrl);
  await expect(collab.getByTestId("parameters-table")).toBeVisible();
  await expect(collab.getByTestId("rerun-fit")).toHaveCount(0);
  const comment = unique("Is γ the right parameter to free here");
  await collab.getByTestId("new-thread-text").fill(comment);
  await collab.getByTestId("new-thread-submit").click();
  await expect(collab.getByTestId("comment-body").filter({ hasText: comment })).toBeVisible();
  await ctx.close();
});
