import type { Locator, Page } from "@playwright/test";
import { DataTable } from "./data-table";
import { LabPage } from "./lab-page";

export class KineticsListPage extends LabPage {
  readonly catalogue: DataTable;
  readonly labKinetics: DataTable;
  readonly newKineticsButton: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.catalogue = new DataTable(page.getByTestId("catalogue-table"));
    this.labKinetics = new DataTable(page.getByTestId("lab-kinetics-table"));
    this.newKineticsButton = page.getByTestId("new-kinetics");
  }

  override get path() {
    return "/kinetics";
  }

  async openCatalogue(name: string) {
    await this.catalogue.link(name).click();
  }
}
