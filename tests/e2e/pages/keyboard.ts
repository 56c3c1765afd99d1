/**
 * Moving through a page by keyboard only (Tab, Shift+Tab), checking at every stop that the focused
 * element shows a focus ring: an outline (app/globals.css, `:focus-visible`) or a box shadow.
 */
import { expect, type Locator, type Page } from "@playwright/test";

export interface FocusStyle {
  tag: string;
  text: string;
  outlineStyle: string;
  outlineWidthPx: number;
  boxShadow: string;
}

/** The focused element's focus-ring style (what a person sees that marks where focus is). */
async function focusStyle(page: Page): Promise<FocusStyle | null> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return null;
    const s = getComputedStyle(el);
    return {
      tag: el.tagName.toLowerCase(),
      text: (el.getAttribute("aria-label") ?? el.textContent ?? el.getAttribute("name") ?? "").trim().slice(0, 40),
      outlineStyle: s.outlineStyle,
      outlineWidthPx: parseFloat(s.outlineWidth) || 0,
      boxShadow: s.boxShadow,
    };
  });
}

/** A ring of at least 1 px, as an outline or a box shadow (WCAG 2.4.7 "Focus Visible"). */
export function hasRing(s: FocusStyle): boolean {
  return (s.outlineStyle !== "none" && s.outlineWidthPx >= 1) || (s.boxShadow !== "none" && s.boxShadow !== "");
}

export class KeyboardPath {
  /** Every element focus stopped on, with its style, for the report of a failure. */
  readonly visited: FocusStyle[] = [];

  constructor(readonly page: Page) {}

  /** Presses Tab (Shift+Tab with `back`) until `target` has focus; each stop must show a ring. */
  async tabTo(target: Locator, { back = false, max = 200 } = {}) {
    for (let i = 0; i < max; i++) {
      await this.page.keyboard.press(back ? "Shift+Tab" : "Tab");
      const style = await focusStyle(this.page);
      if (style) {
        this.visited.push(style);
        expect(hasRing(style), `focus ring on <${style.tag}> “${style.text}”`).toBe(true);
      }
      if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
    }
    throw new Error(`no focus on ${target} after ${max} presses of ${back ? "Shift+Tab" : "Tab"}`);
  }

  /** Tabs to `target` and presses Enter (a link or a button). */
  async activate(target: Locator, key: "Enter" | "Space" = "Enter") {
    await this.tabTo(target);
    await this.page.keyboard.press(key);
  }

  /** Tabs to a text field and types into it. */
  async type(target: Locator, text: string) {
    await this.tabTo(target);
    await this.page.keyboard.type(text);
  }
}
