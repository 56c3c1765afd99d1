/**
 * An OME-TIFF stack from upload to a readout of a chosen plane and channel: the re-run form
 * offers the planes (counted from 1) only because the file has more than one, and the new
 * readout reads the page that holds the 16 px stripes.
 */
import { makeStripes } from "@/lib/synthetic";
import { omeXml, writeTiffPages } from "../support/tiff-writer";
import { unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { ReadoutPage } from "./pages/readout-page";
import { SpecimenPage } from "./pages/specimen-page";
import { StudiesPage } from "./pages/studies-page";
import { StudyPage } from "./pages/study-page";

const W = 160,
  H = 128;
const numberIn = (text: string) => Number(/([0-9]+(?:\.[0-9]+)?)/.exec(text)![1]);
const stripesPage = (wavelengthPx: number, seed: number) => ({
  width: W,
  height: H,
  data: Array.from(makeStripes({ width: W, height: H, wavelengthPx, angleDeg: 0, noise: 0.05, seed }).data, (v) =>
    Math.round(Math.min(1, Math.max(0, v)) * 65535),
  ),
});

test.use({ role: "scientist" });

test("an OME-TIFF stack: the form offers its planes; channel 2, plane 2 is read", async ({ lab, page }) => {
  // 2 channels × 2 planes (XYZCT, page = z + 2·c) at 0.5 µm/px: only channel 2, plane 2 holds
  // 16 px stripes (λ = 8 µm by construction); the other pages 10 px (5 µm).
  const tif = writeTiffPages([stripesPage(10, 1), stripesPage(10, 2), stripesPage(10, 3), stripesPage(16, 4)], {
    bits: 16,
    description: omeXml({ sizeX: W, sizeY: H, sizeC: 2, sizeZ: 2, sizeT: 1, physicalSizeX: 0.5 }),
  });
  const studyName = unique("E2E stack");
  const studies = await lab.open(StudiesPage);
  await studies.create({ name: studyName, tissue: "skin", organism: "chick" });
  await studies.table.row(studyName).getByRole("link", { name: studyName }).click();
  const study = lab.on(StudyPage);
  await study.addSpecimen({ label: "ST-01", condition: "control", stage: "E7" });
  await study.specimens.row("ST-01").getByRole("link", { name: "ST-01" }).click();
  const specimen = lab.on(SpecimenPage);
  await specimen.upload({ name: "stack.ome.tif", mimeType: "image/tiff", buffer: tif });
  await expect(specimen.readoutRows).toHaveCount(1);
  await specimen.openReadout(0);

  const readout = lab.on(ReadoutPage);
  await expect(readout.status).toHaveText("finished", { timeout: 20_000 });
  await expect(readout.rerunForm.getByTestId("stack-fields")).toBeVisible();
  await expect(readout.rerunForm.getByTestId("rerun-time-point")).toHaveCount(0); // one time point
  await readout.chooseChannel("1");
  await readout.choosePlane("plane 2 of 2");
  const firstUrl = page.url();
  await readout.rerun();
  await expect(page).not.toHaveURL(firstUrl);
  await expect(readout.status).toHaveText("finished", { timeout: 20_000 });
  await expect(readout.settings).toContainText("plane 2");
  const lambda = numberIn(await readout.wavelength.innerText());
  expect(Math.abs(lambda - 8) / 8).toBeLessThan(0.01);
});
