/** The "Upload many files" panel of the study and specimen pages, and a reopened batch's page. */
import type { Locator, Page } from "@playwright/test";
import type { FileToUpload } from "./specimen-page";
import { LabPage } from "./lab-page";

export class BatchUploadPanel {
  readonly form: Locator;
  readonly rows: Locator;
  readonly summary: Locator;
  readonly error: Locator;

  constructor(readonly page: Page) {
    this.form = page.getByTestId("batch-form");
    this.rows = page.getByTestId("batch-table").getByTestId("batch-row");
    this.summary = page.getByTestId("batch-summary");
    this.error = page.getByTestId("batch-error");
  }

  /** Into a study, a new specimen per file with one condition and stage for all. */
  async uploadPerFile(files: FileToUpload[], o: { condition: string; stage: string; pixelSizeUm: string }) {
    await this.form.getByTestId("batch-files").setInputFiles(files);
    await this.form.getByTestId("batch-mode-per-file").check();
    await this.form.getByLabel("Batch condition").fill(o.condition);
    await this.form.getByLabel("Batch stage").fill(o.stage);
    await this.form.getByLabel(/^Batch pixel size/).fill(o.pixelSizeUm);
    await this.form.getByTestId("batch-submit").click();
  }

  row(filename: string): Locator {
    return this.rows.filter({ has: this.page.getByTestId("batch-row-file").getByText(filename, { exact: true }) });
  }

  async openBatch() {
    await this.page.getByRole("link", { name: "Open the batch" }).click();
  }
}

export class BatchPage extends LabPage {
  readonly panel: BatchUploadPanel;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.panel = new BatchUploadPanel(page);
  }
}
