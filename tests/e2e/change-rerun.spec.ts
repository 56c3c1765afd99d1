/**
 * Change and re-run, as a modeller: a fit's builder opens filled in, one bound is changed and the
 * new fit started, and the two fits link to each other; a run's form opens filled in, its end time
 * is changed and the new run started, and the two runs link. A bench scientist, who may start fits
 * but not runs, is offered "Change and re-run" on the fit but not "Change and run again" on the run.
 */
import { unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { FitBuilderPage } from "./pages/fit-builder-page";
import { FitPage } from "./pages/fit-page";
import { FitsPage } from "./pages/fits-page";
import { RunFormPage } from "./pages/run-form-page";
import { RunPage } from "./pages/run-page";

test.use({ role: "modeller" });

test("modeller changes one bound of a fit and re-runs it; both fits link to each other", async ({
  lab,
  page,
  signInAs,
}) => {
  test.setTimeout(120_000);
  const fits = await lab.open(FitsPage);
  await fits.newFitButton.click();
  const builder = lab.on(FitBuilderPage);
  await builder.pickSpecimens(["DS-01", "DS-02"]);
  await builder.setLengthScale("40");
  await builder.freeParameter({ name: "gamma", mode: "per-condition", start: "100", lower: "10", upper: "1000" });
  const name = unique("Placode spacing");
  await builder.start(name);
  await expect(page).toHaveURL(/\/fits\/[0-9a-f-]{36}$/);
  const originalUrl = page.url();

  const fit = lab.on(FitPage);
  await fit.changeButton.click();
  await builder.expectHeading("Change and re-run");
  await expect(builder.changedFromNotice).toContainText(`Filled in from the fit “${name}”`);
  await expect(builder.pick("DS-01")).toBeChecked();
  await expect(builder.pick("DS-02")).toBeChecked();
  await expect(builder.lengthScale()).toHaveValue("40");
  await expect(builder.mode("gamma")).toHaveValue("per-condition");
  await expect(builder.bound("gamma", "lower")).toHaveValue("10");
  await expect(builder.bound("gamma", "upper")).toHaveValue("1000");
  await expect(builder.nameField).toHaveValue(`${name} (changed)`);
  await builder.bound("gamma", "upper").fill("900");
  await page.screenshot({ path: "test-results/change-fit-builder.png", fullPage: true });
  await page.getByTestId("start-fit").click();
  await expect(page).toHaveURL(/\/fits\/[0-9a-f-]{36}$/);
  expect(page.url()).not.toBe(originalUrl);

  await expect(fit.changedFromLink).toHaveText(name);
  await page.screenshot({ path: "test-results/change-fit-new.png", fullPage: true });
  await fit.changedFromLink.click();
  await expect(page).toHaveURL(originalUrl);
  await expect(fit.changedIntoLinks).toHaveText([`${name} (changed)`]);

  // A bench scientist may start fits, so is offered the change too.
  const scientist = await signInAs("scientist");
  await scientist.page.goto(originalUrl);
  await expect(scientist.on(FitPage).changeButton).toBeVisible();
});

test("modeller changes a run's end time and runs it again; both runs link to each other", async ({
  lab,
  page,
  signInAs,
}) => {
  test.setTimeout(120_000);
  const form = await lab.open(RunFormPage);
  await expect(form.kinetics).toHaveValue("schnakenberg");
  await form.cells.selectOption("32");
  await form.endTime.fill("20");
  await form.seed.fill("5");
  await form.snapshots.fill("2");
  await form.start();
  await expect(page).toHaveURL(/\/runs\/[0-9a-f-]{36}$/);
  const originalUrl = page.url();
  const run = lab.on(RunPage);
  await run.waitForEnd(90_000);
  const originalName = (await run.heading.textContent())!;

  await run.changeButton.click();
  await form.expectHeading("Change and run again");
  await expect(form.changedFromNotice).toContainText(`Filled in from the run “${originalName}”`);
  await expect(form.cells).toHaveValue("32");
  await expect(form.endTime).toHaveValue("20");
  await expect(form.seed).toHaveValue("5");
  await expect(form.snapshots).toHaveValue("2");
  await form.endTime.fill("30");
  await page.screenshot({ path: "test-results/change-run-form.png", fullPage: true });
  await form.start();
  await expect(page).toHaveURL(/\/runs\/[0-9a-f-]{36}$/);
  expect(page.url()).not.toBe(originalUrl);

  await expect(run.changedFromLink).toHaveText(originalName);
  await run.waitForEnd(90_000);
  await expect(run.scrubberTime).toHaveText("t = 30 model time");
  await page.screenshot({ path: "test-results/change-run-new.png", fullPage: true });
  const newName = (await run.heading.textContent())!;
  await run.changedFromLink.click();
  await expect(page).toHaveURL(originalUrl);
  await expect(run.changedIntoLinks).toHaveText([newName]);

  // A bench scientist may not start runs: no "Change and run again".
  const scientist = await signInAs("scientist");
  await scientist.page.goto(originalUrl);
  await expect(scientist.on(RunPage).status).toBeVisible();
  await expect(scientist.on(RunPage).changeButton).toHaveCount(0);
});
