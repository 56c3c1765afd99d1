/**
 * What every signed-in lab page has: the header (role, lab switcher, navigation), the page heading,
 * and the section's loading skeleton and error boundary. Page objects for single pages extend it.
 */
import { expect, type Locator, type Page } from "@playwright/test";

export class LabPage {
  readonly heading: Locator;
  readonly currentRole: Locator;
  readonly labSwitcher: Locator;
  readonly nav: Locator;
  readonly accountLink: Locator;
  readonly errorBoundary: Locator;
  readonly retryButton: Locator;
  readonly skeleton: Locator;
  readonly notFound: Locator;
  /** The 403 page's sentence: what the visitor's role may and may not do here. */
  readonly roleRefusal: Locator;

  constructor(
    readonly page: Page,
    readonly labId: string,
  ) {
    this.heading = page.getByRole("heading", { level: 1 });
    this.currentRole = page.getByTestId("current-role");
    this.labSwitcher = page.getByTestId("lab-switcher");
    this.nav = page.getByRole("navigation", { name: "Lab" });
    this.accountLink = page.getByTestId("account-link");
    this.errorBoundary = page.getByTestId("error-boundary");
    this.retryButton = page.getByTestId("error-retry");
    this.skeleton = page.getByTestId("page-skeleton");
    this.notFound = page.getByTestId("not-found");
    this.roleRefusal = page.getByTestId("role-refusal");
  }

  /** The lab path of this page ("" for the dashboard); subclasses name theirs. */
  get path(): string {
    return "";
  }

  url(sub = this.path): string {
    return `/labs/${this.labId}${sub}`;
  }

  /** Opens the page and returns the HTTP status of the document (403 for a page the role may not open). */
  async goto(): Promise<number | undefined> {
    return (await this.page.goto(this.url()))?.status();
  }

  /** The links of the lab's navigation, in order. */
  async navLabels(): Promise<string[]> {
    return this.nav.getByRole("link").allTextContents();
  }

  async signOut() {
    await this.page.getByTestId("sign-out").click();
  }

  async expectHeading(text: string | RegExp) {
    await expect(this.heading).toHaveText(text);
  }

  /** The section's error boundary, with plain words and "Try again", and no stack trace. */
  async expectErrorBoundary(what: string) {
    await expect(this.errorBoundary).toBeVisible();
    await expect(this.errorBoundary).toContainText(`We could not load ${what}.`);
    await expect(this.retryButton).toBeVisible();
    await expect(this.errorBoundary).not.toContainText(/at .*:\d+:\d+/);
  }
}
