/**
 * Live status, as a bench scientist: the readouts list, left open in one tab, shows a readout
 * started in another tab and then its end without being reloaded; the new readout's page goes
 * from queued or running to finished by itself.
 * Seeded facts (lib/cli/seed-demo.ts): specimen PR-11 of the study below holds one readout of a
 * 640 × 480 image. (Not DS-01: readouts.spec.ts counts that specimen's readouts.) Expected behaviour is the product's own (common practice, no source).
 */
import { expect, test } from "./pages/fixtures";
import { Lab } from "./pages/lab";
import { ReadoutPage } from "./pages/readout-page";
import { ReadoutsPage } from "./pages/readouts-page";
import { SpecimenPage } from "./pages/specimen-page";
import { StudiesPage } from "./pages/studies-page";
import { StudyPage } from "./pages/study-page";

const STUDY = "Palatal ridge stripes in two genotypes";
const ROI = { x: 96, y: 96, width: 256, height: 256 };
const ROI_WORDS = "ROI 256×256 px at (96, 96)";

test.use({ role: "scientist" });

test("a readout started elsewhere appears in the open list and finishes there without a reload", async ({
  lab,
  page,
  context,
}) => {
  const list = await lab.open(ReadoutsPage);
  await expect(list.table.rows.first()).toBeVisible();
  await expect(list.rowsWith(ROI_WORDS)).toHaveCount(0);
  let reloads = 0;
  page.on("load", () => reloads++);

  // A second tab: the specimen's readout, read again with an ROI.
  const other = await context.newPage();
  const there = new Lab(other, lab.labId);
  await there.open(StudiesPage).then((s) => s.open(STUDY));
  await there.on(StudyPage).openSpecimen("PR-11");
  await there.on(SpecimenPage).openReadout(0);
  const readout = there.on(ReadoutPage);
  await readout.enterRoi(ROI);
  await readout.rerun();
  await expect(readout.settings).toContainText(ROI_WORDS);
  await expect(readout.status).toHaveText("finished", { timeout: 30_000 });

  // The list in the first tab, untouched: the new row is there, finished, with no reload.
  const row = list.rowsWith(ROI_WORDS);
  await expect(row).toHaveCount(1, { timeout: 30_000 });
  await expect(row).toContainText("finished", { timeout: 30_000 });
  expect(reloads).toBe(0);
  await page.screenshot({ path: "/tmp/hygiene-live-list.png", fullPage: true });
  await other.close();
});
