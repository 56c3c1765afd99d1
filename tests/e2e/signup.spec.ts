/** Creating an account with its lab (by the e-mailed confirmation link), a taken address, a wrong password and the lockout. */
import { expect, test } from "@playwright/test";
import { DEMO, DEMO_LAB, DEMO_PASSWORD, unique, uniqueEmail } from "./support/demo";
import { linkTo, mailIds, waitForMail } from "./support/mailbox";
import { E2E_MAILBOX_URL } from "./support/ports";
import { DASHBOARD_URL, signIn, signUp } from "./support/session";
import { DashboardPage } from "./pages/dashboard-page";
import { LoginPage } from "./pages/login-page";
import { SignupPage } from "./pages/signup-page";

test("sign-up creates the account and a lab, and lands on it as lab manager", async ({ page }) => {
  const account = {
    name: "Rowan Teale",
    email: uniqueEmail("signup"),
    password: "placode-spacing-42",
    labName: unique("Feather Tract Group"),
  };
  const labId = await signUp(page, account);
  const dashboard = new DashboardPage(page, labId);

  await dashboard.expectHeading(account.labName);
  await expect(page.getByText("You are lab manager here.")).toBeVisible();
  await expect(dashboard.currentRole).toHaveText("Lab manager");
  await expect(dashboard.accountLink).toHaveText(account.name);
  await expect(dashboard.labSwitcher.locator("option")).toHaveText([account.labName]);
  await expect(dashboard.nav.getByRole("link", { name: "Audit trail" })).toHaveAttribute(
    "href",
    `/labs/${labId}/audit`,
  );

  // The lab is empty and says what to do next.
  await expect(dashboard.emptyStates.first()).toContainText("No studies yet.");

  // The session is real: the API knows who this is.
  const me = await (await page.request.get("/api/v1/me")).json();
  expect(me.email).toBe(account.email);
  expect(me.labs).toEqual([{ id: labId, name: account.labName, role: "manager" }]);
});

// Changed by issue 10, item 9 (no account enumeration): a taken address no longer gets an error
// naming it; the page is the same as for a new address, and the mail tells the owner.
test("signing up again with an address that has an account shows the same page and mails the owner", async ({
  page,
  browser,
}) => {
  const seen = await mailIds(DEMO.scientist.email);
  const signup = new SignupPage(page);
  await signup.goto();
  await signup.fill({
    name: "Someone Else",
    email: DEMO.scientist.email,
    password: "another-password-1",
    labName: unique("Duplicate Lab"),
  });
  await signup.submit();
  await expect(page).toHaveURL(/\/signup\/check-email/);
  await expect(signup.checkEmail).toHaveText(
    `We sent a message to ${DEMO.scientist.email}. Open the link in it to finish creating your account and lab.`,
  );
  // In this local setup the page says where local mail is read (the catcher's listing).
  await expect(signup.localMailCatcher).toContainText(E2E_MAILBOX_URL);
  const mail = await waitForMail(DEMO.scientist.email, seen);
  expect(mail.subject).toBe("You already have a Morphokin account");

  expect((await page.request.get("/api/v1/me")).status()).toBe(401);

  // The mail's one-time sign-in link signs the owner in (made like next-auth's own links).
  const owner = await browser.newContext();
  try {
    const o = await owner.newPage();
    await o.goto(linkTo(mail, "/api/auth/callback/email"));
    await expect(o).toHaveURL(DASHBOARD_URL);
    expect((await (await o.request.get("/api/v1/me")).json()).email).toBe(DEMO.scientist.email);
  } finally {
    await owner.close();
  }

  // The existing account is untouched: same password, still only the demo lab.
  const labId = await signIn(page, DEMO.scientist.email);
  await expect(new DashboardPage(page, labId).labSwitcher.locator("option")).toHaveText([DEMO_LAB]);
});

test("ten wrong passwords lock the account, and the sign-in page says for how long", async ({ page }) => {
  const account = {
    name: "Lia Brandt",
    email: uniqueEmail("lockout"),
    password: "lockout-password-1",
    labName: unique("Lockout Lab"),
  };
  await signUp(page, account);
  await page.context().clearCookies();
  const login = new LoginPage(page);
  await login.goto();
  await login.email.fill(account.email);
  // LOCKOUT_FAILURES defaults to 10 (lib/server/config.ts).
  for (let i = 0; i < 10; i++) {
    await login.password.fill(`wrong-password-${i}`);
    // Wait for the answer itself, so every failure is counted before the next try.
    const answer = page.waitForResponse((r) => r.url().includes("/api/auth/callback/credentials"));
    await login.pressSignIn();
    expect((await answer).status()).toBe(401);
    await expect(login.error).toHaveText("Wrong e-mail or password.");
  }
  await login.password.fill(account.password);
  const locked = page.waitForResponse((r) => r.url().includes("/api/auth/callback/credentials"));
  await login.pressSignIn();
  expect((await locked).status()).toBe(429);
  expect(Number((await locked).headers()["retry-after"])).toBeGreaterThan(14 * 60);
  await expect(login.error).toHaveText(
    "Too many failed sign-ins for this account; try again in 15 minutes or use a sign-in link.",
  );
  expect((await page.request.get("/api/v1/me")).status()).toBe(401);
});

test("a wrong password on the sign-in form says so and stays on the form", async ({ page }) => {
  const login = new LoginPage(page);
  await login.goto();
  await login.submit(DEMO.manager.email, `${DEMO_PASSWORD}-wrong`);
  await expect(login.error).toHaveText("Wrong e-mail or password.");
  await expect(page).toHaveURL(/\/login$/);
  expect((await page.request.get("/api/v1/me")).status()).toBe(401);
});
