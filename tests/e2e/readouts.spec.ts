/**
 * A bench scientist's readouts: a seeded specimen shows its readout's wavelength in µm, the
 * readout page shows the numbers, an entered ROI makes a second readout, and the study page
 * compares the conditions.
 */
import { expect, test } from "@playwright/test";
import { DEMO } from "./support/demo";
import { signIn } from "./support/session";

// Seeded facts (lib/cli/seed-demo.ts), written out on purpose: specimen DS-01 holds a hexagonal
// spot lattice with spacing a = 22 px at 2.0 µm/px, so a = 44 µm and the Fourier wavelength is
// (√3/2)·44 = 38.105 µm (SCIENCE.md §4, geometry).
const STUDY = "Dorsal placode spacing under a signalling inhibitor";
const LAMBDA_UM = (Math.sqrt(3) / 2) * 44;
const numberIn = (text: string) => Number(/([0-9]+(?:\.[0-9]+)?)/.exec(text)![1]);

test("seeded readout with µm, ROI re-run makes a second readout, study comparison", async ({ page }) => {
  const labId = await signIn(page, DEMO.scientist.email);
  await page.goto(`/labs/${labId}/studies`);
  await page.getByTestId("studies-table").getByRole("link", { name: STUDY }).click();
  await page.getByTestId("specimens-table").getByRole("link", { name: "DS-01" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Specimen DS-01");

  const rows = page.getByTestId("readouts-table").getByTestId("readout-row");
  await expect(rows).toHaveCount(1);
  const headline = rows.first().getByTestId("readout-headline");
  await expect(headline).toContainText("µm");
  expect(Math.abs(numberIn(await headline.innerText()) - LAMBDA_UM) / LAMBDA_UM).toBeLessThan(0.01);
  await expect(rows.first()).toContainText("hexagonal");
  await expect(rows.first()).toContainText("2 µm/px (TIFF resolution tags)");

  await rows.first().getByTestId("open-readout").click();
  await expect(page.getByTestId("readout-status")).toHaveText("finished");
  await expect(page.getByTestId("readout-wavelength")).toContainText("µm");
  await expect(page.getByTestId("readout-wavelength")).toContainText("px");
  const nn = numberIn(await page.getByTestId("readout-nn").innerText());
  expect(Math.abs(nn - 44) / 44).toBeLessThan(0.01);
  await expect(page.getByTestId("readout-symmetry")).toContainText("hexagonal");
  await expect(page.getByTestId("readout-pixel-size")).toHaveText("2 µm/px (TIFF resolution tags)");
  await expect(page.getByTestId("spectrum-plot")).toBeVisible();
  await expect(page.getByTestId("orientation-rose")).toBeVisible();
  await expect(page.getByTestId("readout-fft")).toBeVisible();
  const firstUrl = page.url();

  // Enter a rectangle ROI (pixels of the 512 × 512 original) and read again.
  const form = page.getByTestId("rerun-form");
  await form.getByTestId("roi-x").fill("64");
  await form.getByTestId("roi-y").fill("64");
  await form.getByTestId("roi-width").fill("320");
  await form.getByTestId("roi-height").fill("320");
  await expect(form.getByTestId("roi-shape")).toBeVisible();
  await form.getByTestId("rerun-submit").click();
  await expect(page).not.toHaveURL(firstUrl);
  await expect(page.getByTestId("readout-status")).toHaveText("finished", { timeout: 20_000 });
  await expect(page.getByTestId("readout-settings")).toContainText("ROI 320×320 px at (64, 64)");
  const second = numberIn(await page.getByTestId("readout-wavelength").innerText());
  expect(Math.abs(second - LAMBDA_UM) / LAMBDA_UM).toBeLessThan(0.01);
  await expect(page.getByTestId("sibling-readouts").locator("li")).toHaveCount(2);

  // Both readouts are listed on the specimen page; the first one is unchanged.
  await page.getByRole("link", { name: "Specimen DS-01" }).click();
  await expect(rows).toHaveCount(2);
  await expect(rows.filter({ hasText: "whole image" })).toHaveCount(1);
  await expect(rows.filter({ hasText: "ROI 320×320 px" })).toHaveCount(1);

  // The study page compares the two conditions (two specimens each).
  await page.getByRole("link", { name: STUDY }).click();
  const comparison = page.getByTestId("condition-comparison");
  await expect(comparison.getByTestId("comparison-row")).toHaveCount(2);
  await expect(comparison.getByTestId("comparison-row").filter({ hasText: "control" })).toContainText("µm");
  await expect(comparison.getByTestId("comparison-row").filter({ hasText: "inhibitor 5 µM" })).toContainText("2");
  // Specimens are the replicates (one image each in the demo): 2 specimens · 2 images.
  await expect(comparison.getByTestId("replicate")).toHaveValue("specimen");
  await expect(
    comparison.getByTestId("comparison-row").filter({ hasText: "inhibitor 5 µM" }).getByTestId("comparison-counts"),
  ).toHaveText("2 · 2");
  await expect(comparison.getByTestId("welch-result")).toContainText("p =");
  await expect(comparison.getByTestId("welch-result")).toContainText("Hedges");
  const csv = await page.request.get((await page.getByTestId("comparison-csv").getAttribute("href"))!);
  expect(csv.headers()["content-type"]).toContain("text/csv");
  expect((await csv.text()).split("\n").filter((l) => l && !l.startsWith("#")).length).toBe(5); // header + 4 uploads
});
