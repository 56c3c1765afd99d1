/** /signup and the pages after it: check your e-mail, confirm with a password. */
import type { Locator, Page } from "@playwright/test";

export interface NewAccount {
  name: string;
  email: string;
  password: string;
  labName: string;
}

export class SignupPage {
  readonly checkEmail: Locator;
  readonly localMailCatcher: Locator;

  constructor(readonly page: Page) {
    this.checkEmail = page.getByTestId("signup-check-email");
    this.localMailCatcher = page.getByTestId("local-mail-catcher");
  }

  async goto() {
    await this.page.goto("/signup");
  }

  async fill(account: NewAccount) {
    await this.page.getByLabel("Your name").fill(account.name);
    await this.page.getByLabel(/^E-mail/).fill(account.email);
    await this.page.getByLabel(/^Password/).fill(account.password);
    await this.page.getByLabel("Lab name").fill(account.labName);
  }

  async submit() {
    await this.page.getByTestId("create-account").click();
  }

  /** On the page the e-mailed confirmation link opens. */
  async confirm(password: string) {
    await this.page.getByLabel(/^Your password/).fill(password);
    await this.page.getByTestId("confirm-account").click();
  }
}
