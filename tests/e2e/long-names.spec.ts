/**
 * Names of 120 characters (a study, its tissue, a specimen, its condition and a file) are cut to
 * one line with the whole name on hover, and never push a table's columns (or the dashboard's
 * lists) off-screen, at 1280 px and on a 390 px phone.
 */
import sharp from "sharp";
import type { Locator, Page } from "@playwright/test";
import { unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { DashboardPage } from "./pages/dashboard-page";
import { SpecimenPage } from "./pages/specimen-page";
import { StudiesPage } from "./pages/studies-page";
import { StudyPage } from "./pages/study-page";

test.use({ role: "scientist" });

/** 120 characters with no place to break a line: the worst case for a table (the limit of the forms' fields). */
function long(prefix: string, length = 120): string {
  const start = `${unique(prefix)}_`;
  return (start + "x".repeat(length)).slice(0, length);
}

/** The element's right edge is inside the viewport and the page does not scroll sideways. */
async function expectWithinViewport(page: Page, table: Locator, width: number) {
  const box = (await table.boundingBox())!;
  expect(box.x + box.width, "the table's right edge").toBeLessThanOrEqual(width);
  expect(await page.evaluate(() => document.documentElement.scrollWidth), "the page's width").toBeLessThanOrEqual(
    width,
  );
}

/** The name is cut (drawn narrower than its text) and its whole text is on hover. */
async function expectCutWithTitle(name: Locator, text: string) {
  await expect(name).toHaveAttribute("title", text);
  // Polled: a page that streams in lays its lists out after the names are in the document.
  await expect
    .poll(() => name.evaluate((el) => el.scrollWidth > el.clientWidth), {
      message: `“${text.slice(0, 20)}…” is cut with an ellipsis`,
    })
    .toBe(true);
}

test("120-character names are cut with the full name on hover and keep tables on screen", async ({ lab, page }) => {
  const studyName = long("Study");
  const tissue = long("tissue");
  const label = long("Specimen", 120);
  const condition = long("condition");
  const filename = `${long("file", 116)}.png`;

  const studies = await lab.open(StudiesPage);
  await studies.create({ name: studyName, tissue, organism: "chick" });
  await expect(studies.table.link(studyName)).toBeVisible();
  await studies.open(studyName);
  const study = lab.on(StudyPage);
  await study.expectHeading(studyName);
  await study.addSpecimen({ label, condition, stage: "E7" });
  await expect(study.specimens.link(label)).toBeVisible();
  await study.openSpecimen(label);
  const specimen = lab.on(SpecimenPage);
  const png = await sharp({ create: { width: 64, height: 64, channels: 3, background: { r: 90, g: 90, b: 90 } } })
    .png()
    .toBuffer();
  await specimen.upload({ name: filename, mimeType: "image/png", buffer: png }, "0.65");
  await expect(specimen.uploadRow(filename)).toBeVisible();
  const specimenUrl = page.url();

  for (const width of [1280, 390]) {
    await page.setViewportSize({ width, height: 800 });

    await studies.goto();
    await studies.table.filter(studyName);
    await expect(studies.table.rows).toHaveCount(1);
    await expectCutWithTitle(studies.table.link(studyName), studyName);
    await expectWithinViewport(page, studies.table.root.locator("table"), width);
    await page.screenshot({ path: `test-results/long-names-studies-${width}.png` });

    await studies.open(studyName);
    await study.expectHeading(studyName);
    await expectCutWithTitle(study.specimens.link(label), label);
    await expectCutWithTitle(study.specimens.rows.getByTitle(condition), condition);
    await expectWithinViewport(page, study.specimens.root.locator("table"), width);
    await page.screenshot({ path: `test-results/long-names-study-${width}.png`, fullPage: true });

    // The dashboard's recent lists (the study is the newest, so it is listed).
    const dashboard = await lab.open(DashboardPage);
    await expectCutWithTitle(dashboard.recentStudies.getByTitle(studyName), studyName);
    await expectCutWithTitle(dashboard.recentStudies.getByTitle(tissue), tissue);
    expect(
      await page.evaluate(() => document.documentElement.scrollWidth),
      "the dashboard's width",
    ).toBeLessThanOrEqual(width);
    await page.screenshot({ path: `test-results/long-names-dashboard-${width}.png`, fullPage: true });

    await page.goto(specimenUrl);
    await expectCutWithTitle(specimen.uploadRow(filename).getByTestId("download-link"), filename);
    await expectWithinViewport(page, specimen.uploads.root.locator("table"), width);
    await page.screenshot({ path: `test-results/long-names-specimen-${width}.png`, fullPage: true });
  }
});
