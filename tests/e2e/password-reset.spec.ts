/**
 * A bench scientist who forgot their password: "Forgot your password?" on the sign-in page, the
 * link from the fake mailbox, a new password, sign-in with it; the used link then says it does not
 * work and offers to ask again.
 */
import { BASE_URL, DEMO_LAB, uniqueEmail } from "./support/demo";
import { linkTo, mailIds, waitForMail } from "./support/mailbox";
import { DASHBOARD_URL, signIn } from "./support/session";
import { expect, test } from "./pages/fixtures";
import { DashboardPage } from "./pages/dashboard-page";
import { LoginPage } from "./pages/login-page";
import { ForgotPasswordPage, ResetPasswordPage } from "./pages/password-reset-pages";

test.use({ role: "manager" });

test("a bench scientist resets a forgotten password by the e-mailed link and signs in with the new one", async ({
  lab,
  browser,
}) => {
  // A new bench scientist of the demo lab, so the demo accounts keep their passwords.
  const email = uniqueEmail("forgetful");
  const seenInvite = await mailIds(email);
  const invited = await lab.page.request.post(`/api/v1/labs/${lab.labId}/invitations`, {
    headers: { origin: BASE_URL },
    data: { email, role: "scientist" },
  });
  expect(invited.status()).toBe(201);
  const token = new URL(linkTo(await waitForMail(email, seenInvite), "/invite/")).pathname.split("/").pop()!;
  const context = await browser.newContext();
  try {
    const page = await context.newPage();
    // Accepted without a session (the manager's would be refused: the link is bound to the invitee).
    const accepted = await page.request.post(`/api/v1/invitations/${token}/accept`, {
      headers: { origin: BASE_URL },
      data: { name: "Tove Ashgrove", password: "remembered-once-1" },
    });
    expect(accepted.status()).toBe(200);
    const login = new LoginPage(page);
    await login.goto();
    await login.forgotPassword.click();
    await expect(page).toHaveURL(/\/forgot-password$/);
    const seen = await mailIds(email);
    const forgot = new ForgotPasswordPage(page);
    await forgot.ask(email);
    await expect(forgot.message).toContainText(
      "If an account has this address, we sent a link to it. The link works once and expires in 60 minutes.",
    );
    await page.screenshot({ path: "/tmp/accounts-forgot-password.png", fullPage: true });

    const mail = await waitForMail(email, seen);
    expect(mail.subject).toBe("Reset your Morphokin password");
    expect(mail.text).toContain("expires in 60 minutes");
    const link = linkTo(mail, "/reset-password/");
    await page.goto(link);
    const reset = new ResetPasswordPage(page);
    await expect(reset.heading).toHaveText("Choose a new password");
    await page.screenshot({ path: "/tmp/accounts-reset-password.png", fullPage: true });
    await reset.setPassword("chosen-after-reset-2");
    await expect(page).toHaveURL(/\/login\?reset=1$/);
    await expect(login.passwordWasReset).toContainText("Sign in with the new password.");

    await signIn(page, email, "chosen-after-reset-2");
    await expect(page).toHaveURL(DASHBOARD_URL);
    const dashboard = new DashboardPage(page, lab.labId);
    await dashboard.expectHeading(DEMO_LAB);
    await expect(dashboard.currentRole).toHaveText("Bench scientist");

    // The link is used up: a clear page with a way to ask again.
    await page.goto(link);
    await expect(reset.heading).toHaveText("This link does not work");
    await expect(reset.linkProblem).toHaveText("This password reset link was already used; ask for a new one.");
    await page.screenshot({ path: "/tmp/accounts-reset-link-used.png", fullPage: true });
    await reset.askAgain.click();
    await expect(page).toHaveURL(/\/forgot-password$/);
  } finally {
    await context.close();
  }
});
