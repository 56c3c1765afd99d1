/** The shared server-side data table (components/ui/data-table.tsx): filter, sort, rows by text. */
import type { Locator } from "@playwright/test";

export class DataTable {
  readonly rows: Locator;
  readonly firstColumn: Locator;
  readonly filterBox: Locator;
  /** The table's own message when its rows could not be loaded. */
  readonly error: Locator;

  constructor(readonly root: Locator) {
    this.rows = root.locator("tbody tr");
    this.firstColumn = root.locator("tbody tr td:first-child");
    this.filterBox = root.getByLabel("Filter rows");
    this.error = root.getByTestId("table-error");
  }

  row(text: string): Locator {
    return this.root.getByRole("row").filter({ hasText: text });
  }

  link(name: string | RegExp): Locator {
    return this.root.getByRole("link", { name });
  }

  column(n: number): Locator {
    return this.root.locator(`tbody tr td:nth-child(${n})`);
  }

  async filter(text: string) {
    await this.filterBox.fill(text);
  }

  async retry() {
    await this.root.getByTestId("table-retry").click();
  }

  async sortBy(column: string) {
    await this.root.getByTestId(`sort-${column}`).click();
  }
}
