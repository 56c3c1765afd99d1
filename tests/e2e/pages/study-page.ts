import type { Locator, Page } from "@playwright/test";
import { DataTable } from "./data-table";
import { LabPage } from "./lab-page";

export interface NewSpecimen {
  label: string;
  condition: string;
  stage: string;
}

export class StudyPage extends LabPage {
  readonly specimens: DataTable;
  readonly comparison: Locator;
  readonly comparisonRows: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.specimens = new DataTable(page.getByTestId("specimens-table"));
    this.comparison = page.getByTestId("condition-comparison");
    this.comparisonRows = this.comparison.getByTestId("comparison-row");
  }

  async addSpecimen(s: NewSpecimen) {
    await this.page.getByTestId("new-specimen").click();
    const form = this.page.getByTestId("specimen-form");
    await form.getByLabel("Label").fill(s.label);
    await form.getByLabel("Condition").fill(s.condition);
    await form.getByLabel(/^Stage/).fill(s.stage);
    await this.page.getByTestId("save-specimen").click();
  }

  async openSpecimen(label: string) {
    await this.specimens.link(label).click();
  }

  comparisonRow(condition: string): Locator {
    return this.comparisonRows.filter({ hasText: condition });
  }
}
