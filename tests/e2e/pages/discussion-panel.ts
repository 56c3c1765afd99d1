/** The discussion at the bottom of a page and the thread dialog opened from the dashboard. */
import type { Locator, Page } from "@playwright/test";

export class DiscussionPanel {
  readonly thread: Locator;
  readonly comments: Locator;
  readonly notice: Locator;
  readonly mentionHint: Locator;
  readonly replyBox: Locator;

  constructor(readonly page: Page) {
    this.thread = page.getByTestId("thread");
    this.comments = this.thread.getByTestId("comment");
    this.notice = page.getByTestId("discussion-notice");
    this.mentionHint = page.getByTestId("mention-hint");
    this.replyBox = this.thread.getByTestId("reply-box-text");
  }

  /** Starts a thread with one comment on the page's object. */
  async start(text: string) {
    await this.page.getByTestId("new-thread-text").fill(text);
    await this.page.getByTestId("new-thread-submit").click();
  }

  commentBody(text: string): Locator {
    return this.page.getByTestId("comment-body").filter({ hasText: text });
  }

  async openReply() {
    await this.thread.getByTestId("reply-toggle").first().click();
  }

  async pickMention(name: RegExp) {
    await this.mentionHint.getByRole("button", { name }).click();
  }

  async sendReply() {
    await this.thread.getByTestId("reply-box-submit").click();
  }

  async resolve() {
    await this.thread.getByTestId("resolve-thread").click();
  }

  async close() {
    await this.page.getByTestId("close-thread").click();
  }
}
