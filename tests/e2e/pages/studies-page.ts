import type { Locator, Page } from "@playwright/test";
import { DataTable } from "./data-table";
import { LabPage } from "./lab-page";

export interface NewStudy {
  name: string;
  tissue: string;
  organism: string;
}

export class StudiesPage extends LabPage {
  readonly table: DataTable;
  readonly newStudyButton: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.table = new DataTable(page.getByTestId("studies-table"));
    this.newStudyButton = page.getByTestId("new-study");
  }

  override get path() {
    return "/studies";
  }

  async create(study: NewStudy) {
    await this.newStudyButton.click();
    const form = this.page.getByTestId("study-form");
    await form.getByLabel("Name").fill(study.name);
    await form.getByLabel("Tissue").fill(study.tissue);
    await form.getByLabel("Organism").fill(study.organism);
    await this.page.getByTestId("save-study").click();
  }

  async open(name: string) {
    await this.table.link(name).click();
  }
}
