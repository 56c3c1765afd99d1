/** A bench scientist's path: study → specimen → upload, check, download, reject, delete. */
import { createHash, randomBytes } from "node:crypto";
import sharp from "sharp";
import { DEMO, unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { SpecimenPage } from "./pages/specimen-page";
import { StudiesPage } from "./pages/studies-page";
import { StudyPage } from "./pages/study-page";

const sha256 = (b: Buffer) => createHash("sha256").update(b).digest("hex");

async function greyPng(): Promise<Buffer> {
  return sharp({ create: { width: 64, height: 64, channels: 3, background: { r: 128, g: 128, b: 128 } } })
    .greyscale()
    .png()
    .toBuffer();
}

test.describe("bench scientist", () => {
  test.use({ role: "scientist" });

  test("study, specimen, upload with checksum, download, a rejected fake PNG, delete", async ({ lab, page }) => {
    const studyName = unique("E2E scale spacing");

    const studies = await lab.open(StudiesPage);
    await studies.create({ name: studyName, tissue: "ventral scales", organism: "zebrafish" });
    const studyRow = studies.table.row(studyName);
    await expect(studyRow).toContainText("ventral scales");
    await expect(studyRow).toContainText("zebrafish");
    await expect(studyRow).toContainText(DEMO.scientist.email);
    await studyRow.getByRole("link", { name: studyName }).click();
    const study = lab.on(StudyPage);
    await study.expectHeading(studyName);

    await study.addSpecimen({ label: "ZF-07", condition: "control", stage: "30 dpf" });
    const specimenRow = study.specimens.row("ZF-07");
    await expect(specimenRow).toContainText("control");
    await expect(specimenRow).toContainText("30 dpf");
    await specimenRow.getByRole("link", { name: "ZF-07" }).click();
    const specimen = lab.on(SpecimenPage);
    await specimen.expectHeading("Specimen ZF-07");
    await expect(specimen.uploads.root.getByTestId("empty-state")).toContainText("No files yet.");

    // A real PNG with a typed pixel size.
    const png = await greyPng();
    const digest = sha256(png);
    await specimen.upload({ name: "grey-64.png", mimeType: "image/png", buffer: png }, "0.65");
    await expect(specimen.uploadMessage).toHaveText(
      `Stored “grey-64.png” (${png.length} B, SHA-256 ${digest.slice(0, 12)}…).`,
    );
    const row = specimen.uploadRow("grey-64.png");
    await expect(row).toContainText(`${png.length} B`);
    await expect(row).toContainText("image · png");
    await expect(row).toContainText("0.65 µm/px");
    await expect(row).toContainText(`${digest.slice(0, 12)}…`);
    await expect(row.getByTitle(digest)).toBeVisible();

    // The download link returns exactly the bytes that went up.
    const href = await row.getByTestId("download-link").getAttribute("href");
    const res = await page.request.get(href!);
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toContain("image/png");
    const body = await res.body();
    expect(body.length).toBe(png.length);
    expect(sha256(body)).toBe(digest);

    // Binary junk under a .png name is judged by content and refused.
    const junk = Buffer.concat([Buffer.from([0x00, 0x13, 0x37]), randomBytes(509)]);
    await specimen.upload({ name: "not-really.png", mimeType: "image/png", buffer: junk });
    await expect(specimen.uploadMessage).toContainText("“not-really.png” is not a PNG, JPEG or TIFF image");
    await expect(specimen.uploadRow("not-really.png")).toHaveCount(0);
    await expect(specimen.uploads.root).toContainText("1 row");

    // Delete (confirming the dialog): the row goes, the stored original answers 404.
    await specimen.deleteUpload("grey-64.png");
    await expect(specimen.uploadRow("grey-64.png")).toHaveCount(0);
    await expect(specimen.uploads.root.getByTestId("empty-state")).toContainText("No files yet.");
    expect((await page.request.get(href!)).status()).toBe(404);
  });
});

test.describe("modeller", () => {
  test.use({ role: "modeller" });

  test("the studies table filters on the server", async ({ lab }) => {
    const { table } = await lab.open(StudiesPage);
    const names = table.firstColumn;
    await expect(names.filter({ hasText: "Palatal ridge stripes in two genotypes" })).toHaveCount(1);
    const all = await names.allTextContents();
    expect(all.length).toBeGreaterThanOrEqual(2);

    await table.filter("palatal");
    await expect(names).toHaveText(["Palatal ridge stripes in two genotypes"]);
    await expect(table.root.getByText("1 row", { exact: true })).toBeVisible();

    await table.filter("no-such-study-xyz");
    await expect(table.root).toContainText("No rows match “no-such-study-xyz”.");

    await table.filter("");
    await expect(names).toHaveText(all);
  });

  test("the studies table sorts by name on the server", async ({ lab }) => {
    const { table } = await lab.open(StudiesPage);
    const names = table.firstColumn;
    await expect(names.filter({ hasText: "Palatal ridge stripes in two genotypes" })).toHaveCount(1);
    const all = await names.allTextContents();
    // The default order is newest first, which is not alphabetical once a study was added.
    const ascending = [...all].sort();
    await expect(table.root.getByTestId("sort-name")).toBeVisible({ timeout: 2000 });
    await table.sortBy("name");
    await expect(names).toHaveText(ascending);
    await table.sortBy("name");
    await expect(names).toHaveText([...ascending].reverse());
  });
});
