/**
 * A bench scientist finds things from the header's search box: part of an upload's file name and
 * part of a specimen's condition, with the "/" and Ctrl+K shortcuts, arrow keys, Enter, and the
 * full results page. The header holds at 1280 px and 390 px wide.
 */
import sharp from "sharp";
import { BASE_URL, unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { DashboardPage } from "./pages/dashboard-page";
import { SearchBox } from "./pages/search-box";
import { SearchPage } from "./pages/search-page";
import { SpecimenPage } from "./pages/specimen-page";
import type { Page } from "@playwright/test";

test.use({ role: "scientist" });

/** A study, a specimen with an unusual condition and one upload, made through the API as the signed-in scientist. */
async function seed(page: Page, labId: string) {
  const tag = unique("cardamom").slice(-10);
  const headers = { origin: BASE_URL };
  const study = await page.request.post(`/api/v1/labs/${labId}/studies`, {
    headers,
    data: { name: `Search study ${tag}`, tissue: "dorsal skin", organism: "chick" },
  });
  expect(study.status()).toBe(201);
  const specimen = await page.request.post(`/api/v1/labs/${labId}/studies/${(await study.json()).id}/specimens`, {
    headers,
    data: { label: `SR-${tag}`, condition: `Cardamom-treated ${tag}`, stage: "HH31" },
  });
  expect(specimen.status()).toBe(201);
  const specimenId = (await specimen.json()).id as string;
  const png = await sharp({ create: { width: 64, height: 64, channels: 3, background: { r: 90, g: 90, b: 90 } } })
    .png()
    .toBuffer();
  const filename = `feather-tract-${tag}.png`;
  const upload = await page.request.post(`/api/v1/labs/${labId}/specimens/${specimenId}/uploads`, {
    headers,
    multipart: { file: { name: filename, mimeType: "image/png", buffer: png }, pixelSizeUm: "0.65" },
  });
  expect(upload.status()).toBe(201);
  return { tag, filename, specimenLabel: `SR-${tag}`, condition: `Cardamom-treated ${tag}` };
}

test("finds an upload by part of its file name and of its specimen's condition, by keyboard", async ({ lab, page }) => {
  await page.setViewportSize({ width: 1280, height: 800 });
  const s = await seed(page, lab.labId);
  await lab.open(DashboardPage);
  const box = new SearchBox(page);
  await expect(box.hint).toContainText("/");
  await expect(box.hint).toContainText("Ctrl K");

  // "/" with no field focused puts the cursor in the box; part of the file name finds the upload.
  await page.locator("body").press("/");
  await box.type(`tract-${s.tag}`);
  await expect(box.group("Uploads")).toContainText(s.filename);
  await expect(box.group("Uploads")).toContainText(`specimen ${s.specimenLabel}`);
  await page.keyboard.press("ArrowDown");
  await expect(box.chosen).toContainText(s.filename);
  await expect(box.input).toHaveAttribute("aria-activedescendant", /option-0$/);
  await page.screenshot({ path: "test-results/search-1280-suggestions.png" });
  await page.keyboard.press("Enter");
  await expect(page).toHaveURL(/\/specimens\/[0-9a-f-]+$/);
  const specimen = lab.on(SpecimenPage);
  await specimen.expectHeading(`Specimen ${s.specimenLabel}`);

  // Ctrl+K from anywhere; part of the condition finds the specimen and its upload; arrows move and wrap.
  await page.keyboard.press("Control+k");
  await box.type(`cardamom-TREATED ${s.tag.slice(0, 6)}`);
  await expect(box.group("Specimens")).toContainText(s.specimenLabel);
  await expect(box.group("Uploads")).toContainText(s.filename);
  await page.keyboard.press("ArrowDown");
  await expect(box.chosen).toContainText(s.specimenLabel);
  await page.keyboard.press("ArrowDown");
  await expect(box.chosen).toContainText(s.filename);
  await page.keyboard.press("ArrowUp");
  await expect(box.chosen).toContainText(s.specimenLabel);
  await page.keyboard.press("ArrowUp");
  await expect(box.chosen).toContainText("All results for");

  // Enter on "All results" opens the full results page, grouped by kind; a result opens its page.
  await page.keyboard.press("Enter");
  await expect(page).toHaveURL(new RegExp(`/labs/${lab.labId}/search\\?q=`));
  const results = lab.on(SearchPage);
  await results.expectHeading("Search");
  await expect(results.group("specimen")).toContainText(s.specimenLabel);
  await expect(results.group("upload")).toContainText(s.filename);
  await page.screenshot({ path: "test-results/search-1280-results.png", fullPage: true });

  // "/" typed into a field is a character there, not the shortcut.
  await results.input.fill("a/b");
  await expect(results.input).toHaveValue("a/b");
  await expect(results.input).toBeFocused();

  await results.group("upload").getByRole("link", { name: s.filename }).click();
  await specimen.expectHeading(`Specimen ${s.specimenLabel}`);

  // Nothing found says so in words.
  await page.keyboard.press("Control+k");
  await box.type(`no such thing ${s.tag}`);
  await expect(box.list).toContainText(`Nothing in this lab matches “no such thing ${s.tag}”.`);
  await page.keyboard.press("Escape");
  await expect(box.list).toBeHidden();
});

test("a one-letter search on the results page says what is needed", async ({ lab, page }) => {
  await page.goto(`/labs/${lab.labId}/search?q=a`);
  const results = lab.on(SearchPage);
  await expect(results.problem).toHaveText("Search: type at least 2 characters");
});

test("at 390 px wide the header still fits, with the search box on its own line", async ({ lab, page }) => {
  await page.setViewportSize({ width: 390, height: 800 });
  const s = await seed(page, lab.labId);
  await lab.open(DashboardPage);
  const box = new SearchBox(page);
  await expect(box.input).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await box.input.click();
  await box.type(s.condition.toLowerCase());
  await expect(box.group("Uploads")).toContainText(s.filename);
  const list = (await box.list.boundingBox())!;
  expect(list.x).toBeGreaterThanOrEqual(0);
  expect(list.x + list.width).toBeLessThanOrEqual(390);
  await page.screenshot({ path: "test-results/search-390.png" });
});
