import type { Locator, Page } from "@playwright/test";
import { LabPage } from "./lab-page";

export class RunsPage extends LabPage {
  readonly table: Locator;
  readonly newRunButton: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.table = page.getByTestId("runs-table");
    this.newRunButton = page.getByTestId("new-run");
  }

  override get path() {
    return "/runs";
  }
}
