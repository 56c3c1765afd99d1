/** A kinetics' analysis page: classification, predicted wavelength, dispersion and map, parameters. */
import type { Locator, Page } from "@playwright/test";
import { LabPage } from "./lab-page";

export class KineticsPage extends LabPage {
  readonly classification: Locator;
  readonly wavelength: Locator;
  readonly lengthScale: Locator;
  readonly dispersionPlot: Locator;
  readonly dispersionComputing: Locator;
  readonly dispersionError: Locator;
  readonly turingMap: Locator;
  readonly turingFraction: Locator;
  readonly version: Locator;
  readonly versions: Locator;
  readonly simulateLink: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.classification = page.getByTestId("classification");
    this.wavelength = page.getByTestId("predicted-wavelength");
    this.lengthScale = page.getByTestId("length-scale");
    this.dispersionPlot = page.getByTestId("dispersion-plot");
    this.dispersionComputing = page.getByTestId("dispersion-computing");
    this.dispersionError = page.getByTestId("dispersion-error");
    this.turingMap = page.getByTestId("turing-map");
    this.turingFraction = page.getByTestId("turing-fraction");
    this.version = page.getByTestId("kinetics-version");
    this.versions = page.getByTestId("versions-table");
    this.simulateLink = page.getByTestId("simulate-link");
  }

  param(name: string): Locator {
    return this.page.getByTestId(`param-${name}`);
  }

  async setParam(name: string, value: string) {
    await this.param(name).fill(value);
  }
}
