/** /forgot-password (ask for a link) and /reset-password/<token> (choose a new password, or why the link does not work). */
import type { Locator, Page } from "@playwright/test";

export class ForgotPasswordPage {
  readonly message: Locator;

  constructor(readonly page: Page) {
    this.message = page.getByTestId("forgot-password-message");
  }

  async ask(email: string) {
    await this.page
      .getByTestId("forgot-password-form")
      .getByLabel(/^E-mail/)
      .fill(email);
    await this.page.getByTestId("send-reset-link").click();
  }
}

export class ResetPasswordPage {
  readonly heading: Locator;
  readonly linkProblem: Locator;
  readonly askAgain: Locator;

  constructor(readonly page: Page) {
    this.heading = page.getByRole("heading", { level: 1 });
    this.linkProblem = page.getByTestId("link-problem");
    this.askAgain = page.getByTestId("ask-again");
  }

  async setPassword(password: string) {
    const form = this.page.getByTestId("reset-password-form");
    await form.getByLabel(/^New password(?! again)/).fill(password);
    await form.getByLabel(/^New password again/).fill(password);
    await this.page.getByTestId("set-new-password").click();
  }
}
