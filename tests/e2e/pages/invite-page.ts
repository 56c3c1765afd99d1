/** /invite/<token>: the invitee's form, or why it cannot be used. */
import type { Locator, Page } from "@playwright/test";

export class InvitePage {
  readonly heading: Locator;
  readonly error: Locator;
  readonly acceptButton: Locator;

  constructor(readonly page: Page) {
    this.heading = page.getByRole("heading", { level: 1 });
    this.error = page.getByTestId("invite-error");
    this.acceptButton = page.getByTestId("accept-invitation");
  }

  async accept(name: string, password: string) {
    await this.page.getByLabel("Your name").fill(name);
    await this.page.getByLabel(/^Choose a password/).fill(password);
    await this.acceptButton.click();
  }

  async signOutHere() {
    await this.page.getByTestId("invite-sign-out").click();
  }
}
