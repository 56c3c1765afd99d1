import type { Locator, Page } from "@playwright/test";
import { DataTable } from "./data-table";
import { LabPage } from "./lab-page";

export interface FileToUpload {
  name: string;
  mimeType: string;
  buffer: Buffer;
}

export class SpecimenPage extends LabPage {
  readonly uploads: DataTable;
  readonly uploadForm: Locator;
  readonly uploadMessage: Locator;
  readonly readoutRows: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.uploads = new DataTable(page.getByTestId("uploads-table"));
    this.uploadForm = page.getByTestId("upload-form");
    this.uploadMessage = page.getByTestId("upload-message");
    this.readoutRows = page.getByTestId("readouts-table").getByTestId("readout-row");
  }

  /** Uploads one file through the form; `pixelSizeUm` fills "Pixel size" when given. */
  async upload(file: FileToUpload, pixelSizeUm?: string) {
    await this.page.getByTestId("upload-file").setInputFiles(file);
    if (pixelSizeUm !== undefined) await this.page.getByLabel(/^Pixel size/).fill(pixelSizeUm);
    await this.page.getByTestId("upload-submit").click();
  }

  uploadRow(filename: string): Locator {
    return this.uploads.row(filename);
  }

  /** Deletes an upload, accepting the confirmation dialog. */
  async deleteUpload(filename: string) {
    this.page.once("dialog", (d) => void d.accept());
    await this.uploadRow(filename).getByTestId("delete-upload").click();
  }

  async openReadout(index = 0) {
    await this.readoutRows.nth(index).getByTestId("open-readout").click();
  }
}
