/** A verification run's page: status and progress, the comparison sentence, the snapshot scrubber. */
import { expect, type Locator, type Page } from "@playwright/test";
import { LabPage } from "./lab-page";

export class RunPage extends LabPage {
  readonly status: Locator;
  readonly progress: Locator;
  readonly error: Locator;
  readonly comparison: Locator;
  readonly seed: Locator;
  readonly initialState: Locator;
  readonly scrubber: Locator;
  readonly scrubberTime: Locator;
  readonly scrubberSlider: Locator;
  readonly scaleBar: Locator;
  readonly spectrum: Locator;
  readonly changeButton: Locator;
  readonly changedFromLink: Locator;
  readonly changedIntoLinks: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.status = page.getByTestId("run-status");
    this.progress = page.getByTestId("run-progress");
    this.error = page.getByTestId("run-error");
    this.comparison = page.getByTestId("comparison-sentence");
    this.seed = page.getByTestId("run-seed");
    this.initialState = page.getByTestId("run-initial-state");
    this.scrubber = page.getByTestId("snapshot-scrubber");
    this.scrubberTime = this.scrubber.getByTestId("scrubber-time");
    this.scrubberSlider = this.scrubber.getByTestId("scrubber-slider");
    this.scaleBar = this.scrubber.getByTestId("scale-bar");
    this.spectrum = page.getByTestId("spectrum-plot");
    this.changeButton = page.getByTestId("change-run");
    this.changedFromLink = page.getByTestId("run-changed-from-link");
    this.changedIntoLinks = page.getByTestId("run-changed-into-link");
  }

  /** Waits until the run left "queued" and "running". */
  async waitForEnd(timeoutMs = 90_000) {
    await expect(this.status).not.toHaveText(/^(queued|running)$/, { timeout: timeoutMs });
  }

  async continueFromHere() {
    await this.page.getByTestId("continue-run").click();
  }
}
