/** A modeller simulates Schnakenberg from its kinetics page and reads the result; a bench scientist cannot start runs. */
import { expect, test } from "./pages/fixtures";
import { KineticsListPage } from "./pages/kinetics-list-page";
import { KineticsPage } from "./pages/kinetics-page";
import { RunFormPage } from "./pages/run-form-page";
import { RunPage } from "./pages/run-page";
import { RunsPage } from "./pages/runs-page";

test.describe("modeller", () => {
  test.use({ role: "modeller" });

  test("Simulate with these parameters → progress → snapshot scrubber and the comparison sentence", async ({
    lab,
    page,
  }) => {
    test.setTimeout(120_000);
    await (await lab.open(KineticsListPage)).openCatalogue("Schnakenberg");
    const kinetics = lab.on(KineticsPage);
    await expect(kinetics.classification).toHaveText("Turing");
    await kinetics.setParam("d", "25");
    await kinetics.simulateLink.click();

    const form = lab.on(RunFormPage);
    await form.expectHeading("New verification run");
    await expect(form.kinetics).toHaveValue("schnakenberg");
    await expect(form.param("d")).toHaveValue("25");
    // A grid that is not allowed is refused with the solver's limit before any job starts.
    await form.endTime.fill("3000000");
    await form.start();
    await expect(form.error).toHaveText(
      "Simulated time divided by the step cap needs 30000000 steps; the limit is 10000000.",
    );
    await page.screenshot({ path: "test-results/run-form.png", fullPage: true });

    await form.endTime.fill("400");
    await form.seed.fill("7");
    await form.snapshots.fill("5");
    await form.start();
    await expect(page).toHaveURL(/\/runs\/[0-9a-f-]{36}$/);
    const run = lab.on(RunPage);
    await expect(run.progress).toBeVisible();
    await run.waitForEnd(90_000);
    await expect(run.error).toHaveCount(0);
    await expect(run.comparison).toContainText("The simulated wavelength", { timeout: 90_000 });
    await expect(run.comparison).toContainText("the linear prediction 2π/k*");
    await expect(run.status).toHaveText("reached the end time");
    await expect(run.seed).toHaveText("7");

    await expect(run.scrubberTime).toHaveText("t = 400 model time");
    await run.scrubberSlider.fill("0");
    await expect(run.scrubberTime).toHaveText("t = 0 model time");
    await expect(run.scaleBar).toContainText("model length");
    await expect(run.spectrum).toBeVisible();
    await page.screenshot({ path: "test-results/run-page.png", fullPage: true });

    // Start a second run from this pattern at d = 5, where the steady state is stable: does the pattern persist?
    const firstUrl = page.url();
    await run.continueFromHere();
    await form.expectHeading("New verification run");
    await expect(form.startNote).toContainText("Starts from the final fields of");
    await expect(form.param("d")).toHaveValue("25");
    await expect(form.cells).toHaveValue("64");
    await form.param("d").fill("5");
    await form.endTime.fill("50");
    await form.start();
    await expect(page).toHaveURL(/\/runs\/[0-9a-f-]{36}$/);
    expect(page.url()).not.toBe(firstUrl);
    await expect(page.getByText("the run shows whether the earlier pattern persists")).toBeVisible();
    await expect(run.status).toHaveText("reached the end time", { timeout: 90_000 });
    await expect(run.initialState).toContainText("the final fields of the run");
    await expect(run.initialState).toContainText("no added noise");
    await page.screenshot({ path: "test-results/run-continued.png", fullPage: true });

    const runs = await lab.open(RunsPage);
    await expect(runs.table).toContainText("Schnakenberg, 64×64, seed 7");
    await page.screenshot({ path: "test-results/runs-list.png", fullPage: true });
  });
});

test.describe("bench scientist", () => {
  test.use({ role: "scientist" });

  test("no New run, no Simulate link, and the form answers 403 saying why", async ({ lab, page }) => {
    const runs = await lab.open(RunsPage);
    await runs.expectHeading("Verification runs");
    await expect(runs.newRunButton).toHaveCount(0);
    await page.goto(`/labs/${lab.labId}/kinetics/schnakenberg`);
    const kinetics = lab.on(KineticsPage);
    await expect(kinetics.classification).toHaveText("Turing");
    await expect(kinetics.simulateLink).toHaveCount(0);
    const form = lab.on(RunFormPage);
    expect(await form.goto()).toBe(403);
    await expect(form.roleRefusal).toHaveText("Bench scientists can read verification runs but not start them.");
  });
});
