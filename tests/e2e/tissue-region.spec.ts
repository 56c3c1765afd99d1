/**
 * Tissue on a slide: the readout page shows the tissue region it analysed (outline on the preview,
 * its share in words) and the pixels it treated, and "Correct the region" puts that outline into
 * the ROI editor, so that reading again makes a new readout with it as a polygon ROI.
 */
import { expect, test } from "./pages/fixtures";
import { ReadoutPage } from "./pages/readout-page";
import { SpecimenPage } from "./pages/specimen-page";
import { StudiesPage } from "./pages/studies-page";
import { StudyPage } from "./pages/study-page";
import { encodePng } from "../../lib/imaging";
import { makeTissueFrame } from "../../lib/synthetic";

// Seeded study and specimen (lib/cli/seed-demo.ts). Not the placode study: readouts.spec.ts counts
// its uploads per condition.
const STUDY = "Palatal ridge stripes in two genotypes";

/** Hexagonal spots of Fourier wavelength 16 px on an ellipse of tissue covering 40 % of a dark slide, with debris. */
async function tissuePng(): Promise<Buffer> {
  const { image } = makeTissueFrame({
    width: 352,
    height: 288,
    pattern: "spots",
    wavelengthPx: 16,
    tissue: { shape: "ellipse", coverage: 0.4, slide: "dark" },
    vignetting: 3,
    noise: 0.2,
    debrisCount: 20,
    seed: 21,
  });
  let lo = Infinity,
    hi = -Infinity;
  for (const v of image.data) {
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  return encodePng({ ...image, data: image.data.map((v) => (v - lo) / (hi - lo)) });
}

test.use({ role: "scientist" });

test("the tissue region is shown, and correcting it makes a readout with that polygon ROI", async ({ lab, page }) => {
  const studies = await lab.open(StudiesPage);
  await studies.open(STUDY);
  await lab.on(StudyPage).openSpecimen("PR-12");
  const specimen = lab.on(SpecimenPage);
  await specimen.upload({ name: "tissue-spots.png", mimeType: "image/png", buffer: await tissuePng() }, "0.5");
  // Wait for this file's own row (a count taken before the list has loaded would race with it).
  const row = specimen.readoutRows.filter({ hasText: "tissue-spots.png" });
  await expect(row).toHaveCount(1, { timeout: 20_000 });
  await expect(row.getByTestId("readout-headline")).toContainText("µm", { timeout: 30_000 });
  await row.getByTestId("open-readout").click();

  const readout = lab.on(ReadoutPage);
  await expect(readout.status).toHaveText("finished");
  // 16 px × 0.5 µm/px = 8 µm (construction of the generated frame).
  await expect(readout.wavelength).toContainText("µm");
  await expect(readout.symmetry).toContainText("hexagonal");
  await expect(readout.tissueRegion).toContainText("the tissue found automatically");
  await expect(readout.tissueOutline).toBeVisible();
  await expect(readout.treatedPixels).toContainText("replaced by the surrounding intensity");
  await page.getByTestId("readout-preview").scrollIntoViewIfNeeded();
  await page.screenshot({ path: "test-results/tissue-region.png", fullPage: true });

  const firstUrl = page.url();
  await readout.correctRegion();
  await expect(readout.rerunForm.getByTestId("roi-shape")).toBeVisible();
  await readout.rerun();
  await expect(page).not.toHaveURL(firstUrl);
  await expect(readout.status).toHaveText("finished", { timeout: 30_000 });
  await expect(readout.settings).toContainText("ROI");
  await expect(readout.symmetry).toContainText("hexagonal");
});
