/** A fit's result page. */
import { readFile } from "node:fs/promises";
import { expect, type Locator, type Page } from "@playwright/test";
import { LabPage } from "./lab-page";

export class FitPage extends LabPage {
  readonly caution: Locator;
  readonly verdict: Locator;
  readonly parameters: Locator;
  readonly predictedMeasured: Locator;
  readonly residuals: Locator;
  readonly rerunButton: Locator;
  readonly mapFigure: Locator;
  readonly changeButton: Locator;
  readonly changedFromLink: Locator;
  readonly changedIntoLinks: Locator;
  readonly verifyBestLink: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.caution = page.getByTestId("fit-caution");
    this.verdict = page.getByTestId("fit-verdict");
    this.parameters = page.getByTestId("parameters-table");
    this.predictedMeasured = page.getByTestId("predicted-measured");
    this.residuals = page.getByTestId("residuals-table");
    this.rerunButton = page.getByTestId("rerun-fit");
    this.mapFigure = page.getByTestId("fit-map-figure");
    this.changeButton = page.getByTestId("change-fit");
    this.changedFromLink = page.getByTestId("fit-changed-from-link");
    this.changedIntoLinks = page.getByTestId("fit-changed-into-link");
    this.verifyBestLink = page.getByTestId("verify-best");
  }

  /** Waits for the fit job to finish: the verdict appears once the ranking of models is in. */
  async waitForRanking(timeoutMs = 90_000) {
    await expect(this.verdict).toBeVisible({ timeout: timeoutMs });
  }

  /** The figure frame (SVG/PNG buttons) around a chart. */
  figureOf(chart: Locator): Locator {
    return this.page.locator("figure").filter({ has: chart });
  }

  /** Clicks a figure's "SVG" button and returns the downloaded file's text. */
  async exportSvg(figure: Locator): Promise<{ filename: string; svg: string }> {
    const [download] = await Promise.all([
      this.page.waitForEvent("download"),
      figure.getByTestId("figure-svg").click(),
    ]);
    return { filename: download.suggestedFilename(), svg: await readFile(await download.path(), "utf8") };
  }

  fitted(name: string): Locator {
    return this.parameters.getByTestId(`fitted-${name}`);
  }

  interval(name: string): Locator {
    return this.page.getByTestId(`interval-${name}`);
  }
}
