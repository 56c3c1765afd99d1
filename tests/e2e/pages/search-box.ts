/** The lab search box in the header of every lab page: its suggestions and keyboard use. */
import { expect, type Locator, type Page } from "@playwright/test";

export class SearchBox {
  readonly input: Locator;
  readonly hint: Locator;
  readonly list: Locator;
  readonly options: Locator;

  constructor(readonly page: Page) {
    this.input = page.getByRole("combobox", { name: "Search the lab" });
    this.hint = page.getByTestId("lab-search-hint");
    this.list = page.getByRole("listbox", { name: "Search suggestions" });
    this.options = this.list.getByRole("option");
  }

  /** The suggestions under one kind's heading ("Uploads"). */
  group(label: string): Locator {
    return this.list.getByRole("group", { name: label });
  }

  /** The option whose text contains `text`. */
  option(text: string): Locator {
    return this.options.filter({ hasText: text });
  }

  /** The option the arrow keys reached. */
  get chosen(): Locator {
    return this.list.locator('[role="option"][aria-selected="true"]');
  }

  /** Types into the box (after the shortcut focused it) and waits for the answer to that text. */
  async type(text: string) {
    await expect(this.input).toBeFocused();
    await this.input.fill(text);
    await expect(this.list).toBeVisible();
    await expect(this.list).not.toContainText("Searching…");
  }
}
