/**
 * A bench scientist's readouts: a seeded specimen shows its readout's wavelength in µm, the
 * readout page shows the numbers, an entered ROI makes a second readout, and the study page
 * compares the conditions.
 */
import { expect, test } from "./pages/fixtures";
import { ReadoutPage } from "./pages/readout-page";
import { SpecimenPage } from "./pages/specimen-page";
import { StudiesPage } from "./pages/studies-page";
import { StudyPage } from "./pages/study-page";

// Seeded facts (lib/cli/seed-demo.ts), written out on purpose: specimen DS-01 holds a hexagonal
// spot lattice with spacing a = 22 px at 2.0 µm/px, so a = 44 µm and the Fourier wavelength is
// (√3/2)·44 = 38.105 µm (SCIENCE.md §4, geometry).
const STUDY = "Dorsal placode spacing under a signalling inhibitor";
const LAMBDA_UM = (Math.sqrt(3) / 2) * 44;
const numberIn = (text: string) => Number(/([0-9]+(?:\.[0-9]+)?)/.exec(text)![1]);

test.use({ role: "scientist" });

test("seeded readout with µm, ROI re-run makes a second readout, study comparison", async ({ lab, page }) => {
  const studies = await lab.open(StudiesPage);
  await studies.open(STUDY);
  await lab.on(StudyPage).openSpecimen("DS-01");
  const specimen = lab.on(SpecimenPage);
  await specimen.expectHeading("Specimen DS-01");

  const rows = specimen.readoutRows;
  await expect(rows).toHaveCount(1);
  const headline = rows.first().getByTestId("readout-headline");
  await expect(headline).toContainText("µm");
  expect(Math.abs(numberIn(await headline.innerText()) - LAMBDA_UM) / LAMBDA_UM).toBeLessThan(0.01);
  await expect(rows.first()).toContainText("hexagonal");
  await expect(rows.first()).toContainText("2 µm/px (TIFF resolution tags)");

  await specimen.openReadout(0);
  const readout = lab.on(ReadoutPage);
  await expect(readout.status).toHaveText("finished");
  await expect(readout.wavelength).toContainText("µm");
  await expect(readout.wavelength).toContainText("px");
  const nn = numberIn(await readout.nearestNeighbour.innerText());
  expect(Math.abs(nn - 44) / 44).toBeLessThan(0.01);
  await expect(readout.symmetry).toContainText("hexagonal");
  await expect(readout.pixelSize).toHaveText("2 µm/px (TIFF resolution tags)");
  await expect(page.getByTestId("spectrum-plot")).toBeVisible();
  await expect(page.getByTestId("orientation-rose")).toBeVisible();
  await expect(page.getByTestId("readout-fft")).toBeVisible();
  // The Fourier image marks the peak ring (the readout found a period).
  await expect(page.getByTestId("readout-fft-ring")).toBeVisible();
  const firstUrl = page.url();

  // Enter a rectangle ROI (pixels of the 512 × 512 original) and read again.
  await readout.enterRoi({ x: 64, y: 64, width: 320, height: 320 });
  await expect(readout.rerunForm.getByTestId("roi-shape")).toBeVisible();
  await readout.rerun();
  await expect(page).not.toHaveURL(firstUrl);
  await expect(readout.status).toHaveText("finished", { timeout: 20_000 });
  await expect(readout.settings).toContainText("ROI 320×320 px at (64, 64)");
  const second = numberIn(await readout.wavelength.innerText());
  expect(Math.abs(second - LAMBDA_UM) / LAMBDA_UM).toBeLessThan(0.01);
  await expect(readout.siblings).toHaveCount(2);

  // Both readouts are listed on the specimen page; the first one is unchanged.
  await page.getByRole("link", { name: "Specimen DS-01" }).click();
  await expect(rows).toHaveCount(2);
  await expect(rows.filter({ hasText: "whole image" })).toHaveCount(1);
  await expect(rows.filter({ hasText: "ROI 320×320 px" })).toHaveCount(1);

  // The study page compares the two conditions (two specimens each).
  await page.getByRole("link", { name: STUDY }).click();
  const study = lab.on(StudyPage);
  await expect(study.comparisonRows).toHaveCount(2);
  await expect(study.comparisonRow("control")).toContainText("µm");
  await expect(study.comparisonRow("inhibitor 5 µM")).toContainText("2");
  // Specimens are the replicates (one image each in the demo): 2 specimens · 2 images.
  await expect(study.comparison.getByTestId("replicate")).toHaveValue("specimen");
  await expect(study.comparisonRow("inhibitor 5 µM").getByTestId("comparison-counts")).toHaveText("2 · 2");
  await expect(study.comparison.getByTestId("welch-result")).toContainText("p =");
  await expect(study.comparison.getByTestId("welch-result")).toContainText("Hedges");
  const csv = await page.request.get((await page.getByTestId("comparison-csv").getAttribute("href"))!);
  expect(csv.headers()["content-type"]).toContain("text/csv");
  expect((await csv.text()).split("\n").filter((l) => l && !l.startsWith("#")).length).toBe(5); // header + 4 uploads
});
