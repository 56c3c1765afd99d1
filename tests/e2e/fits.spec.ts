/**
 * The modeller fits Schnakenberg to the seeded placode readouts (control vs inhibitor, γ free per
 * condition), waits for the job, and sees parameters with intervals and the verdict; a
 * collaborator opens the fit and comments, but is offered neither "New fit" nor "Re-run".
 */
import { unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { DiscussionPanel } from "./pages/discussion-panel";
import { FitBuilderPage } from "./pages/fit-builder-page";
import { FitPage } from "./pages/fit-page";
import { FitsPage } from "./pages/fits-page";

test.use({ role: "modeller" });

test("modeller fits the placode readouts; a collaborator reads and comments", async ({ lab, page, signInAs }) => {
  test.setTimeout(120_000);
  const fits = await lab.open(FitsPage);
  await fits.newFitButton.click();
  const builder = lab.on(FitBuilderPage);
  await builder.pickSpecimens(["DS-01", "DS-02", "DS-03", "DS-04"]);
  await expect(builder.modelKinetics(0)).toHaveValue("schnakenberg");
  // ℓ = 40 µm puts Schnakenberg's 2π/k* near the seeded ~40–50 µm spacing for γ ≈ 100–200 (from memory of the dispersion at a = 0.1, b = 0.9, d = 20).
  await builder.setLengthScale("40");
  await builder.freeParameter({ name: "gamma", mode: "per-condition", start: "100", lower: "10", upper: "1000" });
  const name = unique("Placodes control vs inhibitor");
  await builder.start(name);
  await expect(page).toHaveURL(/\/fits\/[0-9a-f-]{36}$/);
  const fit = lab.on(FitPage);
  await expect(fit.caution).toContainText("hypothesis");

  await fit.waitForRanking(90_000);
  await expect(fit.fitted("gamma[control]")).toBeVisible();
  await expect(fit.fitted("gamma[inhibitor 5 µM]")).toBeVisible();
  await expect(fit.interval("gamma[control]")).toContainText("…");
  await expect(fit.verdict).toContainText(/Turing|uncertaint/);
  await expect(fit.predictedMeasured).toBeVisible();
  await expect(fit.residuals).toContainText("µm");
  await expect(fit.rerunButton).toBeVisible();
  await expect(fit.mapFigure).toBeVisible({ timeout: 30_000 });
  if (process.env.FIT_SCREENSHOT) await page.screenshot({ path: process.env.FIT_SCREENSHOT, fullPage: true });
  const fitUrl = page.url();

  const collab = await signInAs("collaborator");
  const theirFits = await collab.open(FitsPage);
  await expect(theirFits.table.link(name)).toBeVisible();
  await expect(theirFits.newFitButton).toHaveCount(0);
  await collab.page.goto(fitUrl);
  const theirFit = collab.on(FitPage);
  await expect(theirFit.parameters).toBeVisible();
  await expect(theirFit.rerunButton).toHaveCount(0);
  const comment = unique("Is γ the right parameter to free here");
  const discussion = new DiscussionPanel(collab.page);
  await discussion.start(comment);
  await expect(discussion.commentBody(comment)).toBeVisible();
});
