/** A manager invites by e-mail; the link works once; a revoked link says so. */
import { expect, test, type Page } from "@playwright/test";
import { DEMO, DEMO_LAB, uniqueEmail } from "./support/demo";
import { linkTo, mailIds, waitForMail } from "./support/mailbox";
import { signIn } from "./support/session";

async function invite(page: Page, labId: string, email: string, roleLabel: string): Promise<string> {
  await page.goto(`/labs/${labId}/members`);
  const form = page.getByTestId("invite-form");
  const seen = await mailIds(email);
  await form.getByLabel(/^E-mail/).fill(email);
  await form.getByLabel(/^Role/).selectOption({ label: roleLabel });
  await page.getByTestId("send-invitation").click();
  await expect(page.getByTestId("invite-message")).toContainText(`Invitation e-mailed to ${email} as ${roleLabel}`);
  await expect(page.getByTestId("invitations-table").getByRole("row").filter({ hasText: email })).toContainText(
    "pending",
  );
  const mail = await waitForMail(email, seen);
  expect(mail.subject).toBe(`You are invited to ${DEMO_LAB} on Morphokin`);
  expect(mail.text).toContain(`as ${roleLabel}`);
  return linkTo(mail, "/invite/");
}

test("an invited modeller joins through the e-mailed link, once", async ({ page, browser }) => {
  const labId = await signIn(page, DEMO.manager.email);
  const email = uniqueEmail("invitee");
  const link = await invite(page, labId, email, "Modeller");

  const guest = await browser.newContext();
  try {
    const g = await guest.newPage();
    await g.goto(link);
    await expect(g.getByRole("heading", { level: 1 })).toHaveText(`Join ${DEMO_LAB}`);
    await expect(g.getByText("You are invited as")).toContainText(`Modeller with the address ${email}`);
    await g.getByLabel("Your name").fill("Lio Marchetti");
    await g.getByLabel(/^Choose a password/).fill("turing-wavelength-7");
    await g.getByTestId("accept-invitation").click();
    await expect(g).toHaveURL(`/labs/${labId}`);
    await expect(g.getByRole("heading", { level: 1 })).toHaveText(DEMO_LAB);
    await expect(g.getByTestId("current-role")).toHaveText("Modeller");
    await expect(g.getByTestId("account-link")).toHaveText("Lio Marchetti");

    // The same link a second time: already used.
    await g.goto(link);
    await expect(g.getByTestId("invite-error")).toHaveText(
      "This invitation was already used. Sign in with your e-mail and password instead.",
    );
    await expect(g.getByTestId("accept-invitation")).toHaveCount(0);
  } finally {
    await guest.close();
  }

  // The manager sees the new member and the two audit entries.
  await page.goto(`/labs/${labId}/members`);
  await expect(page.getByTestId(`role-${email}`)).toHaveValue("modeller");
  await expect(page.getByTestId("invitations-table").getByRole("row").filter({ hasText: email })).toContainText(
    "accepted",
  );
  await page.goto(`/labs/${labId}/audit`);
  const audit = page.getByTestId("audit-table");
  await audit.getByLabel("Filter rows").fill(email);
  await expect(audit.getByRole("row").filter({ hasText: "invitation.created" })).toContainText(
    `${DEMO.manager.email} invited ${email} as Modeller`,
  );
  await expect(audit.getByRole("row").filter({ hasText: "member.joined" })).toContainText(
    `${email} accepted the invitation and joined as Modeller`,
  );
  await expect(audit.getByText("2 rows")).toBeVisible();
});

test("a revoked invitation's link says it was revoked", async ({ page, browser }) => {
  const labId = await signIn(page, DEMO.manager.email);
  const email = uniqueEmail("revoked");
  const link = await invite(page, labId, email, "Bench scientist");
  await page.getByTestId(`revoke-${email}`).click();
  await expect(page.getByTestId("invitations-table").getByRole("row").filter({ hasText: email })).toContainText(
    "revoked",
  );
  await expect(page.getByTestId(`revoke-${email}`)).toHaveCount(0);

  const guest = await browser.newContext();
  try {
    const g = await guest.newPage();
    await g.goto(link);
    await expect(g.getByTestId("invite-error")).toHaveText(
      "This invitation was revoked by the lab manager. Ask them for a new one.",
    );
    await expect(g.getByTestId("accept-invitation")).toHaveCount(0);
    // The API refuses too, so the form is not the only guard.
    const res = await g.request.post(`${new URL(link).pathname.replace("/invite/", "/api/v1/invitations/")}/accept`, {
      data: { name: "Late Comer", password: "late-comer-password" },
    });
    expect(res.status()).toBe(409);
  } finally {
    await guest.close();
  }
  await page.goto(`/labs/${labId}/audit`);
  await page.getByTestId("audit-table").getByLabel("Filter rows").fill(email);
  await expect(
    page.getByTestId("audit-table").getByRole("row").filter({ hasText: "invitation.revoked" }),
  ).toContainText(`${DEMO.manager.email} revoked the invitation of ${email}`);
});

test("an invitation link opened while signed in as someone else is refused until they sign out", async ({ page }) => {
  const labId = await signIn(page, DEMO.manager.email);
  const email = uniqueEmail("bound");
  const link = await invite(page, labId, email, "Collaborator");

  // The manager (who could have copied the link) opens it: refused, nothing to submit.
  await page.goto(link);
  await expect(page.getByTestId("invite-error")).toHaveText(
    `You are signed in as ${DEMO.manager.email}; this invitation is for ${email}. Sign out first.`,
  );
  await expect(page.getByTestId("accept-invitation")).toHaveCount(0);
  const res = await page.request.post(`${new URL(link).pathname.replace("/invite/", "/api/v1/invitations/")}/accept`, {
    data: { name: "Not Me", password: "not-me-password" },
  });
  expect(res.status()).toBe(403);

  // Signed out, the invitee's form is there and still works.
  await page.getByTestId("invite-sign-out").click();
  await expect(page.getByTestId("accept-invitation")).toBeVisible();
  await page.getByLabel("Your name").fill("Ines Okafor");
  await page.getByLabel(/^Choose a password/).fill("bound-invitee-pass");
  await page.getByTestId("accept-invitation").click();
  await expect(page).toHaveURL(`/labs/${labId}`);
  await expect(page.getByTestId("current-role")).toHaveText("Collaborator");
});
