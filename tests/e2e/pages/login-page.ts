/** /login: the password form and the sign-in-link form. */
import type { Locator, Page } from "@playwright/test";

export class LoginPage {
  readonly email: Locator;
  readonly password: Locator;
  readonly error: Locator;
  readonly linkEmail: Locator;
  readonly checkEmail: Locator;
  readonly forgotPassword: Locator;
  readonly passwordWasReset: Locator;

  constructor(readonly page: Page) {
    this.email = page.getByLabel(/^E-mail$/);
    this.password = page.getByLabel(/^Password/);
    this.error = page.getByTestId("login-error");
    this.linkEmail = page.getByLabel("E-mail for the link");
    this.checkEmail = page.getByTestId("check-email");
    this.forgotPassword = page.getByTestId("forgot-password");
    this.passwordWasReset = page.getByTestId("password-was-reset");
  }

  async goto() {
    await this.page.goto("/login");
  }

  /** Fills both fields and presses "Sign in"; the caller waits for what should follow. */
  async submit(email: string, password: string) {
    await this.email.fill(email);
    await this.password.fill(password);
    await this.pressSignIn();
  }

  async pressSignIn() {
    await this.page.getByTestId("sign-in").click();
  }

  async askForLink(email: string) {
    await this.linkEmail.fill(email);
    await this.page.getByTestId("send-link").click();
  }
}
