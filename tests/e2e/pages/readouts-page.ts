/** The lab's readouts list (Readouts in the navigation): one row per readout, with its status. */
import type { Locator, Page } from "@playwright/test";
import { DataTable } from "./data-table";
import { LabPage } from "./lab-page";

export class ReadoutsPage extends LabPage {
  readonly table: DataTable;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.table = new DataTable(page.getByTestId("lab-readouts-table"));
  }

  override get path() {
    return "/readouts";
  }

  /** Rows whose Settings column mentions `text` (e.g. "ROI 320×320 px"). */
  rowsWith(text: string): Locator {
    return this.table.rows.filter({ hasText: text });
  }
}
