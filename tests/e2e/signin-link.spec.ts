/** Sign-in by e-mailed link: the link signs in once; the second use is refused. Signing out ends the session. */
import { expect, test } from "@playwright/test";
import { DEMO, DEMO_LAB, unique, uniqueEmail } from "./support/demo";
import { E2E_BASE_URL } from "./support/ports";
import { linkTo, mailIds, waitForMail } from "./support/mailbox";
import { DASHBOARD_URL, labIdOf, signIn, signUp } from "./support/session";
import { AccountPage } from "./pages/account-page";
import { LoginPage } from "./pages/login-page";
import { DashboardPage } from "./pages/dashboard-page";

test("a sign-in link works once", async ({ page, browser }) => {
  const email = DEMO.scientist.email;
  const seen = await mailIds(email);
  const login = new LoginPage(page);
  await login.goto();
  await login.askForLink(email);
  await expect(page).toHaveURL(/\/login\/check-email/);
  await expect(login.checkEmail).toContainText("a sign-in link is on its way");

  const mail = await waitForMail(email, seen);
  expect(mail.subject).toBe("Your Morphokin sign-in link");
  const link = linkTo(mail, "/api/auth/callback/email");
  expect(new URL(link).origin).toBe(E2E_BASE_URL);

  await page.goto(link);
  await expect(page).toHaveURL(DASHBOARD_URL);
  const dashboard = new DashboardPage(page, labIdOf(page));
  await dashboard.expectHeading(DEMO_LAB);
  await expect(dashboard.currentRole).toHaveText("Bench scientist");
  expect((await (await page.request.get("/api/v1/me")).json()).email).toBe(email);

  // A second browser (no session) with the same link: back to sign-in, told why.
  const other = await browser.newContext();
  try {
    const p = await other.newPage();
    await p.goto(link);
    await expect(p).toHaveURL(/\/login\?.*error=Verification/);
    await expect(new LoginPage(p).error).toHaveText(
      "That sign-in link has expired or was already used. Ask for a new one below.",
    );
    expect((await p.request.get("/api/v1/me")).status()).toBe(401);
  } finally {
    await other.close();
  }
});

test("an unknown address gets the same check-your-mail page and no mail", async ({ page }) => {
  const email = "nobody-here@e2e.example";
  const login = new LoginPage(page);
  await login.goto();
  await login.askForLink(email);
  await expect(page).toHaveURL(/\/login\/check-email/);
  await expect(login.checkEmail).toBeVisible();
  // Give a mistaken send time to arrive before concluding none was sent.
  await page.waitForTimeout(1000);
  expect(await mailIds(email)).toEqual(new Set());
});

test("signing out ends the session: the cookie that worked before answers 401 after it", async ({ page, browser }) => {
  await signIn(page, DEMO.collaborator.email);
  const cookies = await page.context().cookies();
  expect(cookies.some((c) => c.name.includes("next-auth.session-token"))).toBe(true);
  const replay = async () => {
    const other = await browser.newContext();
    try {
      await other.addCookies(cookies);
      return (await other.request.get(`${E2E_BASE_URL}/api/v1/me`)).status();
    } finally {
      await other.close();
    }
  };
  expect(await replay()).toBe(200);

  await new DashboardPage(page, labIdOf(page)).signOut();
  await expect(page).toHaveURL(/\/login/);
  expect(await replay()).toBe(401);
});

test("changing the password on the Account page signs out the account's other sessions", async ({ page, browser }) => {
  const account = {
    name: "Noor Vesel",
    email: uniqueEmail("pwchange"),
    password: "first-password-1",
    labName: unique("Vesel Lab"),
  };
  await signUp(page, account);
  const other = await browser.newContext();
  try {
    const o = await other.newPage();
    await signIn(o, account.email, account.password);
    expect((await o.request.get("/api/v1/me")).status()).toBe(200);

    const accountPage = new AccountPage(page);
    await accountPage.goto();
    await accountPage.changePassword(account.password, "second-password-2");
    await expect(accountPage.passwordMessage).toHaveText("Password changed. Signed out 1 other session.");

    expect((await o.request.get("/api/v1/me")).status()).toBe(401);
    expect((await page.request.get("/api/v1/me")).status()).toBe(200);
  } finally {
    await other.close();
  }
});
