/** A manager invites by e-mail; the link works once; a revoked link says so. */
import { DEMO, DEMO_LAB, uniqueEmail } from "./support/demo";
import { linkTo, mailIds, waitForMail } from "./support/mailbox";
import { expect, test } from "./pages/fixtures";
import { AuditPage } from "./pages/audit-page";
import { DashboardPage } from "./pages/dashboard-page";
import { InvitePage } from "./pages/invite-page";
import type { Lab } from "./pages/lab";
import { MembersPage } from "./pages/members-page";

async function invite(lab: Lab, email: string, roleLabel: string): Promise<string> {
  const members = await lab.open(MembersPage);
  const seen = await mailIds(email);
  await members.invite(email, roleLabel);
  await expect(members.inviteMessage).toContainText(`Invitation e-mailed to ${email} as ${roleLabel}`);
  await expect(members.invitations.row(email)).toContainText("pending");
  const mail = await waitForMail(email, seen);
  expect(mail.subject).toBe(`You are invited to ${DEMO_LAB} on Morphokin`);
  expect(mail.text).toContain(`as ${roleLabel}`);
  return linkTo(mail, "/invite/");
}

test.use({ role: "manager" });

test("an invited modeller joins through the e-mailed link, once", async ({ lab, browser }) => {
  const labId = lab.labId;
  const email = uniqueEmail("invitee");
  const link = await invite(lab, email, "Modeller");

  const guest = await browser.newContext();
  try {
    const g = await guest.newPage();
    const invitation = new InvitePage(g);
    await g.goto(link);
    await expect(invitation.heading).toHaveText(`Join ${DEMO_LAB}`);
    await expect(g.getByText("You are invited as")).toContainText(`Modeller with the address ${email}`);
    await invitation.accept("Lio Marchetti", "turing-wavelength-7");
    await expect(g).toHaveURL(`/labs/${labId}`);
    const theirs = new DashboardPage(g, labId);
    await theirs.expectHeading(DEMO_LAB);
    await expect(theirs.currentRole).toHaveText("Modeller");
    await expect(theirs.accountLink).toHaveText("Lio Marchetti");

    // The same link a second time: already used.
    await g.goto(link);
    await expect(invitation.error).toHaveText(
      "This invitation was already used. Sign in with your e-mail and password instead.",
    );
    await expect(invitation.acceptButton).toHaveCount(0);
  } finally {
    await guest.close();
  }

  // The manager sees the new member and the two audit entries.
  const members = await lab.open(MembersPage);
  await expect(members.roleOf(email)).toHaveValue("modeller");
  await expect(members.invitations.row(email)).toContainText("accepted");
  const { table: audit } = await lab.open(AuditPage);
  await audit.filter(email);
  await expect(audit.row("invitation.created")).toContainText(`${DEMO.manager.email} invited ${email} as Modeller`);
  await expect(audit.row("member.joined")).toContainText(`${email} accepted the invitation and joined as Modeller`);
  await expect(audit.root.getByText("2 rows")).toBeVisible();
});

test("a revoked invitation's link says it was revoked", async ({ lab, browser }) => {
  const email = uniqueEmail("revoked");
  const link = await invite(lab, email, "Bench scientist");
  const members = lab.on(MembersPage);
  await members.revokeButton(email).click();
  await expect(members.invitations.row(email)).toContainText("revoked");
  await expect(members.revokeButton(email)).toHaveCount(0);

  const guest = await browser.newContext();
  try {
    const g = await guest.newPage();
    await g.goto(link);
    const invitation = new InvitePage(g);
    await expect(invitation.error).toHaveText(
      "This invitation was revoked by the lab manager. Ask them for a new one.",
    );
    await expect(invitation.acceptButton).toHaveCount(0);
    // The API refuses too, so the form is not the only guard.
    const res = await g.request.post(`${new URL(link).pathname.replace("/invite/", "/api/v1/invitations/")}/accept`, {
      data: { name: "Late Comer", password: "late-comer-password" },
    });
    expect(res.status()).toBe(409);
  } finally {
    await guest.close();
  }
  const { table: audit } = await lab.open(AuditPage);
  await audit.filter(email);
  await expect(audit.row("invitation.revoked")).toContainText(
    `${DEMO.manager.email} revoked the invitation of ${email}`,
  );
});

test("an invitation link opened while signed in as someone else is refused until they sign out", async ({
  lab,
  page,
}) => {
  const labId = lab.labId;
  const email = uniqueEmail("bound");
  const link = await invite(lab, email, "Collaborator");

  // The manager (who could have copied the link) opens it: refused, nothing to submit.
  await page.goto(link);
  const invitation = new InvitePage(page);
  await expect(invitation.error).toHaveText(
    `You are signed in as ${DEMO.manager.email}; this invitation is for ${email}. Sign out first.`,
  );
  await expect(invitation.acceptButton).toHaveCount(0);
  const res = await page.request.post(`${new URL(link).pathname.replace("/invite/", "/api/v1/invitations/")}/accept`, {
    data: { name: "Not Me", password: "not-me-password" },
  });
  expect(res.status()).toBe(403);

  // Signed out, the invitee's form is there and still works.
  await invitation.signOutHere();
  await expect(invitation.acceptButton).toBeVisible();
  await invitation.accept("Ines Okafor", "bound-invitee-pass");
  await expect(page).toHaveURL(`/labs/${labId}`);
  await expect(new DashboardPage(page, labId).currentRole).toHaveText("Collaborator");
});
