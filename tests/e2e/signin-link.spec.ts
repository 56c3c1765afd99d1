/** Sign-in by e-mailed link: the link signs in once; the second use is refused. Signing out ends the session. */
import { expect, test } from "@playwright/test";
import { DEMO, DEMO_LAB, unique, uniqueEmail } from "./support/demo";
import { E2E_BASE_URL } from "./support/ports";
import { linkTo, mailIds, waitForMail } from "./support/mailbox";
import { DASHBOARD_URL, signIn, signUp } from "./support/session";

test("a sign-in link works once", async ({ page, browser }) => {
  const email = DEMO.scientist.email;
  const seen = await mailIds(email);
  await page.goto("/login");
  await page.getByLabel("E-mail for the link").fill(email);
  await page.getByTestId("send-link").click();
  await expect(page).toHaveURL(/\/login\/check-email/);
  await expect(page.getByTestId("check-email")).toContainText("a sign-in link is on its way");

  const mail = await waitForMail(email, seen);
  expect(mail.subject).toBe("Your Morphokin sign-in link");
  const link = linkTo(mail, "/api/auth/callback/email");
  expect(new URL(link).origin).toBe(E2E_BASE_URL);

  await page.goto(link);
  await expect(page).toHaveURL(DASHBOARD_URL);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(DEMO_LAB);
  await expect(page.getByTestId("current-role")).toHaveText("Bench scientist");
  expect((await (await page.request.get("/api/v1/me")).json()).email).toBe(email);

  // A second browser (no session) with the same link: back to sign-in, told why.
  const other = await browser.newContext();
  try {
    const p = await other.newPage();
    await p.goto(link);
    await expect(p).toHaveURL(/\/login\?.*error=Verification/);
    await expect(p.getByTestId("login-error")).toHaveText(
      "That sign-in link has expired or was already used. Ask for a new one below.",
    );
    expect((await p.request.get("/api/v1/me")).status()).toBe(401);
  } finally {
    await other.close();
  }
});

test("an unknown address gets the same check-your-mail page and no mail", async ({ page }) => {
  const email = "nobody-here@e2e.example";
  await page.goto("/login");
  await page.getByLabel("E-mail for the link").fill(email);
  await page.getByTestId("send-link").click();
  await expect(page).toHaveURL(/\/login\/check-email/);
  await expect(page.getByTestId("check-email")).toBeVisible();
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

  await page.getByTestId("sign-out").click();
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

    await page.goto("/account");
    const form = page.getByTestId("password-form");
    await form.getByLabel(/^Current password/).fill(account.password);
    await form.getByLabel(/^New password/).fill("second-password-2");
    await page.getByTestId("change-password").click();
    await expect(page.getByTestId("password-message")).toHaveText("Password changed. Signed out 1 other session.");

    expect((await o.request.get("/api/v1/me")).status()).toBe(401);
    expect((await page.request.get("/api/v1/me")).status()).toBe(200);
  } finally {
    await other.close();
  }
});
