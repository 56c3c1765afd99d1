/** The new verification run form. */
import type { Locator, Page } from "@playwright/test";
import { LabPage } from "./lab-page";

export class RunFormPage extends LabPage {
  readonly kinetics: Locator;
  readonly endTime: Locator;
  readonly seed: Locator;
  readonly snapshots: Locator;
  readonly cells: Locator;
  readonly error: Locator;
  readonly startNote: Locator;
  readonly changedFromNotice: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.kinetics = page.getByTestId("run-kinetics");
    this.endTime = page.getByTestId("run-end-time");
    this.seed = page.getByTestId("run-seed");
    this.snapshots = page.getByTestId("run-snapshots");
    this.cells = page.getByTestId("run-cells");
    this.error = page.getByTestId("run-error");
    this.startNote = page.getByTestId("run-start-note");
    this.changedFromNotice = page.getByTestId("run-changed-from");
  }

  override get path() {
    return "/runs/new";
  }

  param(name: string): Locator {
    return this.page.getByTestId(`run-param-${name}`);
  }

  async start() {
    await this.page.getByTestId("start-run").click();
  }
}
