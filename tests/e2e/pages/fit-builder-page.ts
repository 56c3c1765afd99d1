/** The new-fit builder: readouts picked by specimen, one kinetics per model, parameter settings. */
import type { Locator, Page } from "@playwright/test";
import { LabPage } from "./lab-page";

export interface FreeParameter {
  name: string;
  mode: "per-condition" | "shared" | "fixed";
  start: string;
  lower: string;
  upper: string;
}

export class FitBuilderPage extends LabPage {
  constructor(page: Page, labId: string) {
    super(page, labId);
  }

  override get path() {
    return "/fits/new";
  }

  /** "Filled in from the fit …" when the builder was opened by "Change and re-run". */
  get changedFromNotice(): Locator {
    return this.page.getByTestId("fit-changed-from");
  }

  pick(specimen: string): Locator {
    return this.page.getByTestId(`pick-${specimen}`);
  }

  mode(parameter: string): Locator {
    return this.page.getByTestId(`mode-${parameter}`);
  }

  bound(parameter: string, side: "lower" | "upper"): Locator {
    return this.page.getByTestId(`${side}-${parameter}`);
  }

  lengthScale(model = 0): Locator {
    return this.page.getByTestId(`model-${model}-length-scale`);
  }

  get nameField(): Locator {
    return this.page.getByTestId("fit-name");
  }

  async pickSpecimens(labels: string[]) {
    for (const s of labels) await this.page.getByTestId(`pick-${s}`).check();
  }

  modelKinetics(model = 0): Locator {
    return this.page.getByTestId(`model-${model}-kinetics`);
  }

  async setLengthScale(um: string, model = 0) {
    await this.page.getByTestId(`model-${model}-length-scale`).fill(um);
  }

  async freeParameter(p: FreeParameter) {
    await this.page.getByTestId(`mode-${p.name}`).selectOption(p.mode);
    await this.page.getByTestId(`start-${p.name}`).fill(p.start);
    await this.page.getByTestId(`lower-${p.name}`).fill(p.lower);
    await this.page.getByTestId(`upper-${p.name}`).fill(p.upper);
  }

  async start(name: string) {
    await this.page.getByTestId("fit-name").fill(name);
    await this.page.getByTestId("start-fit").click();
  }
}
