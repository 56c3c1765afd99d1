/** Signing in and out through the real forms, and small page-level look-ups. */
import { expect, type Page } from "@playwright/test";
import { DEMO_PASSWORD } from "./demo";
import { linkTo, mailIds, waitForMail } from "./mailbox";

/** Matches a lab dashboard URL and captures the lab id. */
export const DASHBOARD_URL = /\/labs\/([^/?#]+)$/;

export function labIdOf(page: Page): string {
  const m = new URL(page.url()).pathname.match(/^\/labs\/([^/]+)/);
  if (!m) throw new Error(`not inside a lab: ${page.url()}`);
  return m[1];
}

/** Signs in with the password form and waits for the lab dashboard; returns the lab id. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<string> {
  await page.goto("/login");
  await page.getByLabel(/^E-mail$/).fill(email);
  await page.getByLabel(/^Password/).fill(password);
  await page.getByTestId("sign-in").click();
  await expect(page).toHaveURL(DASHBOARD_URL);
  return labIdOf(page);
}

export interface NewAccount {
  name: string;
  email: string;
  password: string;
  labName: string;
}

/**
 * Creates an account and its lab through /signup: the form, the "check your e-mail" page, the
 * confirmation link from the fake mailbox and the password; returns the new lab's id.
 */
export async function signUp(page: Page, account: NewAccount): Promise<string> {
  const seen = await mailIds(account.email);
  await page.goto("/signup");
  await fillSignup(page, account);
  await page.getByTestId("create-account").click();
  await expect(page).toHaveURL(/\/signup\/check-email/);
  const mail = await waitForMail(account.email, seen);
  expect(mail.subject).toBe("Confirm your Morphokin account");
  await page.goto(linkTo(mail, "/signup/confirm/"));
  await page.getByLabel(/^Your password/).fill(account.password);
  await page.getByTestId("confirm-account").click();
  await expect(page).toHaveURL(DASHBOARD_URL);
  return labIdOf(page);
}

export async function fillSignup(page: Page, account: NewAccount) {
  await page.getByLabel("Your name").fill(account.name);
  await page.getByLabel(/^E-mail/).fill(account.email);
  await page.getByLabel(/^Password/).fill(account.password);
  await page.getByLabel("Lab name").fill(account.labName);
}

/** The links of the lab's navigation bar, in order. */
export async function navLabels(page: Page): Promise<string[]> {
  return page.getByRole("navigation", { name: "Lab" }).getByRole("link").allTextContents();
}
