/** /account: the user's labs, another lab, API tokens. Not inside a lab, so no LabPage. */
import type { Locator, Page } from "@playwright/test";
import { DataTable } from "./data-table";

export class AccountPage {
  readonly myLabs: Locator;
  readonly tokens: DataTable;
  readonly tokenSecret: Locator;
  readonly tokenName: Locator;
  readonly tokenExpiry: Locator;
  readonly errorBoundary: Locator;
  readonly passwordMessage: Locator;

  constructor(readonly page: Page) {
    this.myLabs = page.getByTestId("my-labs");
    this.tokens = new DataTable(page.getByTestId("tokens-table"));
    this.tokenSecret = page.getByTestId("token-secret");
    this.tokenName = page.getByLabel("Token name");
    this.tokenExpiry = page.getByLabel("Expires after");
    this.errorBoundary = page.getByTestId("error-boundary");
    this.passwordMessage = page.getByTestId("password-message");
  }

  async goto() {
    await this.page.goto("/account");
  }

  async createLab(name: string) {
    await this.page.getByLabel("Start another lab").fill(name);
    await this.page.getByTestId("create-lab").click();
  }

  /** Creates a token with the default lifetime; read the secret from `tokenSecret`. */
  async createToken(name: string) {
    await this.tokenName.fill(name);
    await this.page.getByTestId("create-token").click();
  }

  /** The secret shown once after creating a token. */
  async shownSecret(): Promise<string> {
    return (await this.tokenSecret.locator("code").textContent())!.trim();
  }

  async changePassword(current: string, next: string) {
    const form = this.page.getByTestId("password-form");
    await form.getByLabel(/^Current password/).fill(current);
    await form.getByLabel(/^New password/).fill(next);
    await this.page.getByTestId("change-password").click();
  }

  async revoke(name: string) {
    await this.tokens.row(name).getByRole("button", { name: "Revoke" }).click();
  }
}
