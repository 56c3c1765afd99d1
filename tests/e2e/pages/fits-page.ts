import type { Locator, Page } from "@playwright/test";
import { DataTable } from "./data-table";
import { LabPage } from "./lab-page";

export class FitsPage extends LabPage {
  readonly table: DataTable;
  readonly newFitButton: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.table = new DataTable(page.getByTestId("fits-table"));
    this.newFitButton = page.getByTestId("new-fit");
  }

  override get path() {
    return "/fits";
  }
}
