/** Signing in and out through the real forms, and small page-level look-ups. */
import { expect, type Page } from "@playwright/test";
import { DEMO_PASSWORD } from "./demo";
import { linkTo, mailIds, waitForMail } from "./mailbox";
import { LoginPage } from "../pages/login-page";
import { SignupPage, type NewAccount } from "../pages/signup-page";

export type { NewAccount };

/** Matches a lab dashboard URL and captures the lab id. */
export const DASHBOARD_URL = /\/labs\/([^/?#]+)$/;

export function labIdOf(page: Page): string {
  const m = new URL(page.url()).pathname.match(/^\/labs\/([^/]+)/);
  if (!m) throw new Error(`not inside a lab: ${page.url()}`);
  return m[1];
}

/** Signs in with the password form and waits for the lab dashboard; returns the lab id. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<string> {
  const login = new LoginPage(page);
  await login.goto();
  await login.submit(email, password);
  await expect(page).toHaveURL(DASHBOARD_URL);
  return labIdOf(page);
}

/**
 * Creates an account and its lab through /signup: the form, the "check your e-mail" page, the
 * confirmation link from the fake mailbox and the password; returns the new lab's id.
 */
export async function signUp(page: Page, account: NewAccount): Promise<string> {
  const seen = await mailIds(account.email);
  const signup = new SignupPage(page);
  await signup.goto();
  await signup.fill(account);
  await signup.submit();
  await expect(page).toHaveURL(/\/signup\/check-email/);
  const mail = await waitForMail(account.email, seen);
  expect(mail.subject).toBe("Confirm your Morphokin account");
  await page.goto(linkTo(mail, "/signup/confirm/"));
  await signup.confirm(account.password);
  await expect(page).toHaveURL(DASHBOARD_URL);
  return labIdOf(page);
}

export async function fillSignup(page: Page, account: NewAccount) {
  await new SignupPage(page).fill(account);
}

/** The links of the lab's navigation bar, in order. */
export async function navLabels(page: Page): Promise<string[]> {
  return page.getByRole("navigation", { name: "Lab" }).getByRole("link").allTextContents();
}
