import { expect, type Page } from "@playwright/test";
import { DataTable } from "./data-table";
import { LabPage } from "./lab-page";

export class AuditPage extends LabPage {
  readonly table: DataTable;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.table = new DataTable(page.getByTestId("audit-table"));
  }

  override get path() {
    return "/audit";
  }

  /** The summaries of the entries matching `filter`, newest first. */
  async summaries(filter: string): Promise<string[]> {
    await this.table.filter(filter);
    await expect(this.table.rows.first()).toContainText(filter);
    return this.table.column(4).allTextContents();
  }
}
