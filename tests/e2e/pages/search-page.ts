import type { Locator, Page } from "@playwright/test";
import { LabPage } from "./lab-page";

/** The full search results page, /labs/:labId/search?q=… */
export class SearchPage extends LabPage {
  readonly input: Locator;
  readonly summary: Locator;
  readonly problem: Locator;
  readonly emptyState: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.input = page.getByTestId("search-page-input");
    this.summary = page.getByTestId("search-summary");
    this.problem = page.getByTestId("search-problem");
    this.emptyState = page.getByTestId("empty-state");
  }

  get path(): string {
    return "/search";
  }

  /** The list of hits of one kind ("upload", "specimen", …). */
  group(kind: string): Locator {
    return this.page.getByTestId(`search-group-${kind}`);
  }
}
