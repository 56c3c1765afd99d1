/**
 * "Verify the best by simulation", as a modeller: from the demo lab's fit, the link opens the run
 * form filled in with the kinetics ranked first at its fitted parameters for the chosen condition
 * (kinetics and parameters locked, since they are the fit's); the run started from it ends with the
 * comparison against that condition's measured mean and links back to the fit. A collaborator, who
 * may not start runs, is not offered the link.
 */
import { expect, test } from "./pages/fixtures";
import { FitPage } from "./pages/fit-page";
import { RunFormPage } from "./pages/run-form-page";
import { RunPage } from "./pages/run-page";

test.use({ role: "modeller" });

// The demo lab's fit (lib/cli/seed-demo.ts), found by its name: other tests add newer fits.
const SEEDED_FIT = "Placode spacing: Schnakenberg, γ per condition";

async function seededFit(page: import("@playwright/test").Page, labId: string) {
  const res = await page.request.get(`/api/v1/labs/${labId}/fits?pageSize=100&q=${encodeURIComponent(SEEDED_FIT)}`);
  expect(res.status()).toBe(200);
  const { items } = (await res.json()) as { items: { id: string; name: string }[] };
  const fit = items.find((f) => f.name === SEEDED_FIT);
  expect(fit, "the demo lab seeds its fit").toBeDefined();
  return fit!;
}

test("modeller verifies the best-ranked kinetics of a fit by simulation; the run links back to the fit", async ({
  lab,
  page,
  signInAs,
}) => {
  test.setTimeout(180_000);
  const fitRow = await seededFit(page, lab.labId);
  await page.goto(`/labs/${lab.labId}/fits/${fitRow.id}`);
  const fit = lab.on(FitPage);
  await fit.waitForRanking();
  await expect(fit.verifyBestLink).toHaveText("Verify the best by simulation");
  await expect(page.getByTestId("verify-best-row")).toContainText(
    "(ranked first) at its fitted parameters for “control”",
  );
  await fit.verifyBestLink.click();

  const form = lab.on(RunFormPage);
  await expect(page).toHaveURL(/\/runs\/new\?/);
  await form.expectHeading("New verification run");
  await expect(page.getByTestId("run-from-fit")).toContainText(
    `From the fit ${fitRow.name} (schnakenberg), condition “control”`,
  );
  await expect(form.kinetics).toHaveValue("schnakenberg");
  await expect(form.kinetics).toBeDisabled();
  // γ was free per condition between 10 and 1000 (lib/cli/seed-demo.ts): its fitted value is filled in.
  const gamma = Number(await form.param("gamma").inputValue());
  expect(gamma).toBeGreaterThanOrEqual(10);
  expect(gamma).toBeLessThanOrEqual(1000);
  await expect(form.param("gamma")).toBeDisabled();
  await page.screenshot({ path: "test-results/verify-best-form.png", fullPage: true });

  await form.endTime.fill("8");
  await form.seed.fill("11");
  await form.start();
  await expect(page).toHaveURL(/\/runs\/[0-9a-f-]{36}$/);
  const run = lab.on(RunPage);
  await run.waitForEnd(150_000);
  await expect(run.error).toHaveCount(0);
  const fromFit = page.getByTestId("fit-comparison");
  await expect(fromFit).toContainText("condition “control”: measured");
  await fromFit.getByRole("link", { name: fitRow.name }).click();
  await expect(page).toHaveURL(new RegExp(`/fits/${fitRow.id}$`));
  await page.screenshot({ path: "test-results/verify-best-back.png", fullPage: true });

  // A collaborator reads the fit but may not start runs: no link.
  const collaborator = await signInAs("collaborator");
  await collaborator.page.goto(`/labs/${lab.labId}/fits/${fitRow.id}`);
  await collaborator.on(FitPage).waitForRanking();
  await expect(collaborator.page.getByTestId("verify-best")).toHaveCount(0);
});
