/**
 * "Verify the best by simulation", as a modeller: from a fit comparing two kinetics, the link opens the run
 * form filled in with the kinetics ranked first at its fitted parameters for the chosen condition
 * (kinetics and parameters locked, since they are the fit's); the run started from it ends with the
 * comparison against that condition's measured mean and links back to the fit. A collaborator, who
 * may not start runs, is not offered the link.
 */
import { BASE_URL, unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { FitPage } from "./pages/fit-page";
import { RunFormPage } from "./pages/run-form-page";
import { RunPage } from "./pages/run-page";

test.use({ role: "modeller" });

/**
 * A comparison of two kinetics, started through the API as the modeller. Typed measurements, two per
 * condition (invented, near the demo placodes): Schnakenberg with γ per condition can meet both
 * conditions, the Brusselator with a and b shared by both conditions cannot, so Schnakenberg ranks
 * first by AICc (the fit's own ranking; common practice, no source).
 */
async function comparisonFit(page: import("@playwright/test").Page, labId: string) {
  const name = unique("Which kinetics for the placodes");
  const data = [
    ["control", 38.1],
    ["control", 39.0],
    ["inhibitor 5 µM", 46.8],
    ["inhibitor 5 µM", 47.8],
  ].map(([condition, wavelengthUm]) => ({
    condition,
    kind: "fourier",
    wavelengthUm,
    uncertaintyUm: 0.5,
  }));
  const res = await page.request.post(`/api/v1/labs/${labId}/fits`, {
    headers: { origin: BASE_URL },
    data: {
      name,
      data,
      models: [
        {
          kinetics: "schnakenberg",
          lengthScaleUm: 40,
          parameters: {
            gamma: { mode: "per-condition", start: 100, lower: 10, upper: 1000, log: true },
            d: { mode: "fixed", value: 20 },
          },
        },
        {
          kinetics: "brusselator",
          lengthScaleUm: 40,
          parameters: {
            a: { mode: "free", start: 1.5, lower: 0.5, upper: 5 },
            b: { mode: "free", start: 2.5, lower: 0.5, upper: 20 },
            Dv: { mode: "fixed", value: 10 },
          },
        },
      ],
      options: { profiles: false },
    },
  });
  expect(res.status(), await res.text()).toBe(202);
  return { id: ((await res.json()) as { id: string }).id, name };
}

test("modeller verifies the best-ranked kinetics of a fit by simulation; the run links back to the fit", async ({
  lab,
  page,
  signInAs,
}) => {
  test.setTimeout(180_000);
  const fitRow = await comparisonFit(page, lab.labId);
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
    `From the fit ${fitRow.name} (Schnakenberg), condition “control”`,
  );
  await expect(form.kinetics).toHaveValue("schnakenberg");
  await expect(form.kinetics).toBeDisabled();
  // γ was free per condition between 10 and 1000 (lib/cli/seed-demo.ts): its fitted value is filled in.
  const gamma = Number(await form.param("gamma").inputValue());
  expect(gamma).toBeGreaterThanOrEqual(10);
  expect(gamma).toBeLessThanOrEqual(1000);
  await expect(form.param("gamma")).toBeDisabled();
  // The box holds 8 of the condition's measured wavelengths: 8 × 38.55 µm / 40 µm = 7.71 model lengths
  // (mean of the typed 38.1 and 39.0 µm; arithmetic, no source), not the default 100 (about 100 periods).
  await expect(page.getByLabel(/^Lx/)).toHaveValue("7.71");
  await expect(page.getByLabel(/^Ly/)).toHaveValue("7.71");
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
  await fit.waitForRanking();
  await page.screenshot({ path: "test-results/verify-best-back.png", fullPage: true });

  // A collaborator reads the fit but may not start runs: no link.
  const collaborator = await signInAs("collaborator");
  await collaborator.page.goto(`/labs/${lab.labId}/fits/${fitRow.id}`);
  await collaborator.on(FitPage).waitForRanking();
  await expect(collaborator.page.getByTestId("verify-best")).toHaveCount(0);
});
