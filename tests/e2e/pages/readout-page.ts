import type { Locator, Page } from "@playwright/test";
import { LabPage } from "./lab-page";

export interface Roi {
  x: number;
  y: number;
  width: number;
  height: number;
}

export class ReadoutPage extends LabPage {
  readonly status: Locator;
  readonly wavelength: Locator;
  readonly nearestNeighbour: Locator;
  readonly symmetry: Locator;
  readonly pixelSize: Locator;
  readonly settings: Locator;
  readonly siblings: Locator;
  readonly rerunForm: Locator;
  readonly error: Locator;
  readonly tableColumns: Locator;
  readonly tissueRegion: Locator;
  readonly treatedPixels: Locator;
  readonly tissueOutline: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.status = page.getByTestId("readout-status");
    this.wavelength = page.getByTestId("readout-wavelength");
    this.nearestNeighbour = page.getByTestId("readout-nn");
    this.symmetry = page.getByTestId("readout-symmetry");
    this.pixelSize = page.getByTestId("readout-pixel-size");
    this.settings = page.getByTestId("readout-settings");
    this.siblings = page.getByTestId("sibling-readouts").locator("li");
    this.rerunForm = page.getByTestId("rerun-form");
    this.error = page.getByTestId("readout-error");
    this.tableColumns = page.getByTestId("table-columns");
    this.tissueRegion = page.getByTestId("readout-tissue-region");
    this.treatedPixels = page.getByTestId("readout-treated-pixels");
    this.tissueOutline = page.getByTestId("readout-tissue-outline");
  }

  /** Fills the column fields of a table re-run (header names or letters) without submitting. */
  async chooseColumns(columns: Partial<Record<"x" | "y" | "position" | "spacing", string>>) {
    for (const [role, name] of Object.entries(columns))
      await this.rerunForm.getByTestId(`rerun-column-${role}`).fill(name);
  }

  /** Fills a rectangle ROI (pixels of the original) without submitting, so the caller can look at it. */
  async enterRoi(roi: Roi) {
    const f = this.rerunForm;
    await f.getByTestId("roi-x").fill(String(roi.x));
    await f.getByTestId("roi-y").fill(String(roi.y));
    await f.getByTestId("roi-width").fill(String(roi.width));
    await f.getByTestId("roi-height").fill(String(roi.height));
  }

  /** Fills the re-run form's ROI editor with the tissue outline found by the readout. */
  async correctRegion() {
    await this.rerunForm.getByTestId("rerun-correct-region").click();
  }

  async rerun() {
    await this.rerunForm.getByTestId("rerun-submit").click();
  }

  /** Picks a plane of a stack in the re-run form by its label, e.g. "plane 2 of 2" or "maximum over all 3 planes". */
  async choosePlane(label: string) {
    await this.rerunForm.getByTestId("rerun-plane").selectOption({ label });
  }

  /** Picks a channel in the re-run form by its value ("luminance", "0", "1", …). */
  async chooseChannel(value: string) {
    await this.rerunForm.getByTestId("rerun-channel").selectOption(value);
  }
}
