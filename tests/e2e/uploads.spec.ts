/** A bench scientist's path: study → specimen → upload, check, download, reject, delete. */
import { createHash, randomBytes } from "node:crypto";
import { expect, test } from "@playwright/test";
import sharp from "sharp";
import { DEMO, unique } from "./support/demo";
import { signIn } from "./support/session";

const sha256 = (b: Buffer) => createHash("sha256").update(b).digest("hex");

async function greyPng(): Promise<Buffer> {
  return sharp({ create: { width: 64, height: 64, channels: 3, background: { r: 128, g: 128, b: 128 } } })
    .greyscale()
    .png()
    .toBuffer();
}

test("study, specimen, upload with checksum, download, a rejected fake PNG, delete", async ({ page }) => {
  const labId = await signIn(page, DEMO.scientist.email);
  const studyName = unique("E2E scale spacing");

  await page.goto(`/labs/${labId}/studies`);
  await page.getByTestId("new-study").click();
  const studyForm = page.getByTestId("study-form");
  await studyForm.getByLabel("Name").fill(studyName);
  await studyForm.getByLabel("Tissue").fill("ventral scales");
  await studyForm.getByLabel("Organism").fill("zebrafish");
  await page.getByTestId("save-study").click();
  const studyRow = page.getByTestId("studies-table").getByRole("row").filter({ hasText: studyName });
  await expect(studyRow).toContainText("ventral scales");
  await expect(studyRow).toContainText("zebrafish");
  await expect(studyRow).toContainText(DEMO.scientist.email);
  await studyRow.getByRole("link", { name: studyName }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(studyName);

  await page.getByTestId("new-specimen").click();
  const specimenForm = page.getByTestId("specimen-form");
  await specimenForm.getByLabel("Label").fill("ZF-07");
  await specimenForm.getByLabel("Condition").fill("control");
  await specimenForm.getByLabel(/^Stage/).fill("30 dpf");
  await page.getByTestId("save-specimen").click();
  const specimenRow = page.getByTestId("specimens-table").getByRole("row").filter({ hasText: "ZF-07" });
  await expect(specimenRow).toContainText("control");
  await expect(specimenRow).toContainText("30 dpf");
  await specimenRow.getByRole("link", { name: "ZF-07" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Specimen ZF-07");
  await expect(page.getByTestId("uploads-table").getByTestId("empty-state")).toContainText("No files yet.");

  // A real PNG with a typed pixel size.
  const png = await greyPng();
  const digest = sha256(png);
  await page.getByTestId("upload-file").setInputFiles({ name: "grey-64.png", mimeType: "image/png", buffer: png });
  await page.getByLabel(/^Pixel size/).fill("0.65");
  await page.getByTestId("upload-submit").click();
  await expect(page.getByTestId("upload-message")).toHaveText(
    `Stored “grey-64.png” (${png.length} B, SHA-256 ${digest.slice(0, 12)}…).`,
  );
  const row = page.getByTestId("uploads-table").getByRole("row").filter({ hasText: "grey-64.png" });
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
  await page.getByTestId("upload-file").setInputFiles({ name: "not-really.png", mimeType: "image/png", buffer: junk });
  await page.getByTestId("upload-submit").click();
  await expect(page.getByTestId("upload-message")).toContainText("“not-really.png” is not a PNG, JPEG or TIFF image");
  await expect(page.getByTestId("uploads-table").getByRole("row").filter({ hasText: "not-really.png" })).toHaveCount(0);
  await expect(page.getByTestId("uploads-table")).toContainText("1 row");

  // Delete (confirming the dialog): the row goes, the stored original answers 404.
  page.once("dialog", (d) => void d.accept());
  await row.getByTestId("delete-upload").click();
  await expect(page.getByTestId("uploads-table").getByRole("row").filter({ hasText: "grey-64.png" })).toHaveCount(0);
  await expect(page.getByTestId("uploads-table").getByTestId("empty-state")).toContainText("No files yet.");
  expect((await page.request.get(href!)).status()).toBe(404);
});

test("the studies table filters on the server", async ({ page }) => {
  const labId = await signIn(page, DEMO.modeller.email);
  await page.goto(`/labs/${labId}/studies`);
  const table = page.getByTestId("studies-table");
  const names = table.locator("tbody tr td:first-child");
  await expect(names.filter({ hasText: "Palatal ridge stripes in two genotypes" })).toHaveCount(1);
  const all = await names.allTextContents();
  expect(all.length).toBeGreaterThanOrEqual(2);

  await table.getByLabel("Filter rows").fill("palatal");
  await expect(names).toHaveText(["Palatal ridge stripes in two genotypes"]);
  await expect(table.getByText("1 row", { exact: true })).toBeVisible();

  await table.getByLabel("Filter rows").fill("no-such-study-xyz");
  await expect(table).toContainText("No rows match “no-such-study-xyz”.");

  await table.getByLabel("Filter rows").fill("");
  await expect(names).toHaveText(all);
});

test("the studies table sorts by name on the server", async ({ page }) => {
  const labId = await signIn(page, DEMO.modeller.email);
  await page.goto(`/labs/${labId}/studies`);
  const table = page.getByTestId("studies-table");
  const names = table.locator("tbody tr td:first-child");
  await expect(names.filter({ hasText: "Palatal ridge stripes in two genotypes" })).toHaveCount(1);
  const all = await names.allTextContents();
  // The default order is newest first, which is not alphabetical once a study was added.
  const ascending = [...all].sort();
  await expect(table.getByTestId("sort-name")).toBeVisible({ timeout: 2000 });
  await table.getByTestId("sort-name").click();
  await expect(names).toHaveText(ascending);
  await table.getByTestId("sort-name").click();
  await expect(names).toHaveText([...ascending].reverse());
});
