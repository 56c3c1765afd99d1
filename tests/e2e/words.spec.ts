/**
 * Words a biologist reads: a collaborator who opens the fit builder is told what the role may and
 * may not do (403, not "Not found"); a bench scientist types the pixel size with a decimal comma.
 */
import sharp from "sharp";
import { unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { FitBuilderPage } from "./pages/fit-builder-page";
import { SpecimenPage } from "./pages/specimen-page";
import { StudiesPage } from "./pages/studies-page";
import { StudyPage } from "./pages/study-page";

test.describe("collaborator", () => {
  test.use({ role: "collaborator" });

  test("the fit builder says collaborators can read fits but not start them", async ({ lab, page }) => {
    const builder = lab.on(FitBuilderPage);
    expect(await builder.goto()).toBe(403);
    await expect(builder.roleRefusal).toHaveText("Collaborators can read fits but not start them.");
    await expect(builder.notFound).toHaveCount(0);
    await page.screenshot({ path: "/tmp/words-403.png", fullPage: true });
  });
});

test.describe("bench scientist", () => {
  test.use({ role: "scientist" });

  test("a pixel size typed with a decimal comma (0,65) is stored as 0.65 µm/px", async ({ lab, page }) => {
    const studyName = unique("E2E decimal comma");
    const studies = await lab.open(StudiesPage);
    await studies.create({ name: studyName, tissue: "dorsal skin", organism: "chick" });
    await studies.table.row(studyName).getByRole("link", { name: studyName }).click();
    const study = lab.on(StudyPage);
    await study.addSpecimen({ label: "DC-01", condition: "control", stage: "E7" });
    await study.specimens.row("DC-01").getByRole("link", { name: "DC-01" }).click();
    const specimen = lab.on(SpecimenPage);
    await specimen.expectHeading("Specimen DC-01");
    const png = await sharp({ create: { width: 32, height: 32, channels: 3, background: "#808080" } })
      .png()
      .toBuffer();
    await specimen.upload({ name: "comma.png", mimeType: "image/png", buffer: png }, "0,65");
    await expect(specimen.uploadRow("comma.png")).toContainText("0.65 µm/px");
    await page.screenshot({ path: "/tmp/words-comma.png", fullPage: true });
  });
});
