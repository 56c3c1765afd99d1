/** A modeller simulates Schnakenberg from its kinetics page and reads the result; a bench scientist cannot start runs. */
import { expect, test } from "@playwright/test";
import { DEMO } from "./support/demo";
import { signIn } from "./support/session";

test("modeller: Simulate with these parameters → progress → snapshot scrubber and the comparison sentence", async ({
  page,
}) => {
  test.setTimeout(120_000);
  const labId = await signIn(page, DEMO.modeller.email);
  await page.goto(`/labs/${labId}/kinetics`);
  await page.getByTestId("catalogue-table").getByRole("link", { name: "Schnakenberg" }).click();
  await expect(page.getByTestId("classification")).toHaveText("Turing");
  await page.getByTestId("param-d").fill("25");
  await page.getByTestId("simulate-link").click();

  await expect(page.getByRole("heading", { level: 1 })).toHaveText("New verification run");
  await expect(page.getByTestId("run-kinetics")).toHaveValue("schnakenberg");
  await expect(page.getByTestId("run-param-d")).toHaveValue("25");
  // A grid that is not allowed is refused with the solver's limit before any job starts.
  await page.getByTestId("run-end-time").fill("3000000");
  await page.getByTestId("start-run").click();
  await expect(page.getByTestId("run-error")).toHaveText("endTimeS / dtS needs 30000000 steps; the limit is 10000000.");
  await page.screenshot({ path: "test-results/run-form.png", fullPage: true });

  await page.getByTestId("run-end-time").fill("400");
  await page.getByTestId("run-seed").fill("7");
  await page.getByTestId("run-snapshots").fill("5");
  await page.getByTestId("start-run").click();
  await expect(page).toHaveURL(/\/runs\/[0-9a-f-]{36}$/);
  await expect(page.getByTestId("run-progress")).toBeVisible();
  await expect(page.getByTestId("run-status")).not.toHaveText(/^(queued|running)$/, { timeout: 90_000 });
  await expect(page.getByTestId("run-error")).toHaveCount(0);
  await expect(page.getByTestId("comparison-sentence")).toContainText("The simulated wavelength", { timeout: 90_000 });
  await expect(page.getByTestId("comparison-sentence")).toContainText("the linear prediction 2π/k*");
  await expect(page.getByTestId("run-status")).toHaveText("reached the end time");
  await expect(page.getByTestId("run-seed")).toHaveText("7");

  const scrubber = page.getByTestId("snapshot-scrubber");
  await expect(scrubber.getByTestId("scrubber-time")).toHaveText("t = 400 model time");
  await scrubber.getByTestId("scrubber-slider").fill("0");
  await expect(scrubber.getByTestId("scrubber-time")).toHaveText("t = 0 model time");
  await expect(scrubber.getByTestId("scale-bar")).toContainText("model length");
  await expect(page.getByTestId("spectrum-plot")).toBeVisible();
  await page.screenshot({ path: "test-results/run-page.png", fullPage: true });

  // Start a second run from this pattern at d = 5, where the steady state is stable: does the pattern persist?
  const firstUrl = page.url();
  await page.getByTestId("continue-run").click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("New verification run");
  await expect(page.getByTestId("run-start-note")).toContainText("Starts from the final fields of");
  await expect(page.getByTestId("run-param-d")).toHaveValue("25");
  await expect(page.getByTestId("run-cells")).toHaveValue("64");
  await page.getByTestId("run-param-d").fill("5");
  await page.getByTestId("run-end-time").fill("50");
  await page.getByTestId("start-run").click();
  await expect(page).toHaveURL(/\/runs\/[0-9a-f-]{36}$/);
  expect(page.url()).not.toBe(firstUrl);
  await expect(page.getByText("the run shows whether the earlier pattern persists")).toBeVisible();
  await expect(page.getByTestId("run-status")).toHaveText("reached the end time", { timeout: 90_000 });
  await expect(page.getByTestId("run-initial-state")).toContainText("the final fields of the run");
  await expect(page.getByTestId("run-initial-state")).toContainText("no added noise");
  await page.screenshot({ path: "test-results/run-continued.png", fullPage: true });

  await page.goto(`/labs/${labId}/runs`);
  await expect(page.getByTestId("runs-table")).toContainText("Schnakenberg, 64×64, seed 7");
  await page.screenshot({ path: "test-results/runs-list.png", fullPage: true });
});

test("bench scientist: no New run, no Simulate link, and the form answers not-found", async ({ page }) => {
  const labId = await signIn(page, DEMO.scientist.email);
  await page.goto(`/labs/${labId}/runs`);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Verification runs");
  await expect(page.getByTestId("new-run")).toHaveCount(0);
  await page.goto(`/labs/${labId}/kinetics/schnakenberg`);
  await expect(page.getByTestId("classification")).toHaveText("Turing");
  await expect(page.getByTestId("simulate-link")).toHaveCount(0);
  expect((await page.goto(`/labs/${labId}/runs/new`))?.status()).toBe(404);
});
