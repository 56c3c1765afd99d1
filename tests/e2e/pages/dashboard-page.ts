import type { Locator, Page } from "@playwright/test";
import { LabPage } from "./lab-page";

export class DashboardPage extends LabPage {
  readonly recentStudies: Locator;
  readonly openDiscussions: Locator;
  /** "No … yet" panels that say what to do next. */
  readonly emptyStates: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.recentStudies = page.getByTestId("recent-studies");
    this.openDiscussions = page.getByTestId("open-discussion");
    this.emptyStates = page.getByTestId("empty-state");
  }

  /** The open-discussion row whose text contains `text`. */
  thread(text: string): Locator {
    return this.openDiscussions.filter({ hasText: text });
  }

  async openThread(text: string) {
    await this.thread(text).getByTestId("open-thread").click();
  }
}
