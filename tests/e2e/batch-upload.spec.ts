/**
 * Many files at once into a study: two generated patterns and one file that is not an image.
 * Each file gets its row with progress and status; the bad one fails alone with the reason; the
 * summary shows λ values, and the batch reopens on its own page.
 */
import { DEMO, unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { BatchPage, BatchUploadPanel } from "./pages/batch-upload-panel";
import { StudiesPage } from "./pages/studies-page";
import { StudyPage } from "./pages/study-page";
import { encodePng } from "@/lib/imaging";
import { makeHexSpots, makeStripes } from "@/lib/synthetic";

test.describe("batch upload", () => {
  test.use({ role: "scientist" });

  test("three files into a study: per-file rows, one failure in words, the summary with λ", async ({ lab, page }) => {
    // Stripes of period 16 px and hexagonal spots of spacing 24 px at 0.5 µm/px: λ = 8 µm and
    // (√3/2)·24·0.5 = 10.39 µm by construction (SCIENCE.md §5).
    const stripes = await encodePng(
      makeStripes({ width: 192, height: 160, wavelengthPx: 16, angleDeg: 30, noise: 0.1, seed: 11 }),
    );
    const spots = await encodePng(
      makeHexSpots({ width: 256, height: 256, spacingPx: 24, angleDeg: 8, spotRadiusPx: 6, noise: 0.05, seed: 3 }),
    );
    const notAnImage = Buffer.from([...Buffer.from("%PDF-1.4\n"), 0, 1, 2, 3]);

    const studyName = unique("E2E batch");
    const studies = await lab.open(StudiesPage);
    await studies.create({ name: studyName, tissue: "dorsal skin", organism: "chick" });
    await studies.table.row(studyName).getByRole("link", { name: studyName }).click();
    const study = lab.on(StudyPage);
    await study.expectHeading(studyName);

    const batch = new BatchUploadPanel(page);
    await batch.uploadPerFile(
      [
        { name: "E7-stripes.png", mimeType: "image/png", buffer: stripes },
        { name: "E7-spots.png", mimeType: "image/png", buffer: spots },
        { name: "notes.png", mimeType: "image/png", buffer: notAnImage },
      ],
      { condition: "control", stage: "E7", pixelSizeUm: "0.5" },
    );
    await expect(batch.rows).toHaveCount(3);
    const bad = batch.row("notes.png");
    await expect(bad).toHaveAttribute("data-status", "failed", { timeout: 30_000 });
    await expect(bad).toContainText("is not a PNG, JPEG or TIFF image");
    await expect(batch.row("E7-stripes.png")).toHaveAttribute("data-status", "read", { timeout: 60_000 });
    await expect(batch.row("E7-spots.png")).toHaveAttribute("data-status", "read", { timeout: 60_000 });
    await expect(batch.row("E7-stripes.png").getByTestId("batch-row-wavelength")).toContainText(/^8\.0\d* ± /);
    await expect(batch.row("E7-stripes.png")).toContainText("stripes");
    await expect(batch.row("E7-spots.png").getByTestId("batch-row-wavelength")).toContainText(/^10\.[34]\d* ± /);
    await expect(batch.row("E7-spots.png")).toContainText("hexagonal");
    await expect(batch.summary).toContainText("All read: 2 with a period, 0 without a significant period, 1 failed.");
    // The specimens table gained one specimen per stored file, named from the file name.
    await expect(study.specimens.row("E7-stripes")).toContainText("control");
    await expect(study.specimens.row("E7-spots")).toContainText("E7");
    await page.screenshot({ path: "test-results/batch-upload-study.png", fullPage: true });

    await batch.openBatch();
    const reopened = lab.on(BatchPage);
    await expect(reopened.heading).toContainText("Batch of");
    await expect(reopened.panel.rows).toHaveCount(3);
    await expect(reopened.panel.row("notes.png")).toHaveAttribute("data-status", "failed");
    await expect(reopened.panel.summary).toContainText("3 file(s): 2 read, 0 without a significant period, 1 failed.");
    await expect(page.getByText(DEMO.scientist.email)).toBeVisible();
    await page.screenshot({ path: "test-results/batch-upload-reopened.png", fullPage: true });
  });
});
