/** The lab kinetics editor (new or a new version). */
import type { Locator, Page } from "@playwright/test";
import { LabPage } from "./lab-page";

export interface ParameterRow {
  name: string;
  default: string;
  min: string;
  max: string;
}

export class KineticsEditorPage extends LabPage {
  readonly error: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.error = page.getByTestId("kinetics-error");
  }

  async setName(name: string) {
    await this.page.getByTestId("kinetics-name").fill(name);
  }

  async setReaction(index: number, expression: string) {
    await this.page.getByTestId(`reaction-${index}`).fill(expression);
  }

  async setDiffusion(index: number, value: string) {
    await this.page.getByTestId(`diffusion-${index}`).fill(value);
  }

  /** Fills parameter rows in order; the form starts with one row, the rest are added. */
  async setParameters(rows: ParameterRow[]) {
    for (const [i, p] of rows.entries()) {
      if (i > 0) await this.page.getByTestId("add-parameter").click();
      await this.page.getByTestId(`param-name-${i}`).fill(p.name);
      await this.page.getByTestId(`param-default-${i}`).fill(p.default);
      await this.page.getByTestId(`param-min-${i}`).fill(p.min);
      await this.page.getByTestId(`param-max-${i}`).fill(p.max);
    }
  }

  async save() {
    await this.page.getByTestId("save-kinetics").click();
  }
}
