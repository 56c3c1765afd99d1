/** The manager changes roles; the last lab manager cannot demote themselves. */
import { BASE_URL, DEMO } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { AuditPage } from "./pages/audit-page";
import { MembersPage } from "./pages/members-page";

test.use({ role: "manager" });

test("the manager changes a member's role and back; the audit trail records both", async ({ lab, page }) => {
  try {
    const members = await lab.open(MembersPage);
    await members.setRole(DEMO.scientist.email, "Collaborator", "collaborator");
    await page.reload();
    await expect(members.roleOf(DEMO.scientist.email)).toHaveValue("collaborator");

    await members.setRole(DEMO.scientist.email, "Bench scientist", "scientist");
    await page.reload();
    await expect(members.roleOf(DEMO.scientist.email)).toHaveValue("scientist");

    const audit = await lab.open(AuditPage);
    const summaries = await audit.summaries(`changed ${DEMO.scientist.email}`);
    // Newest first.
    expect(summaries.slice(0, 2)).toEqual([
      `${DEMO.manager.email} changed ${DEMO.scientist.email} from Collaborator to Bench scientist`,
      `${DEMO.manager.email} changed ${DEMO.scientist.email} from Bench scientist to Collaborator`,
    ]);
  } finally {
    // Leave the demo lab as seeded for the other specs, even when an assertion failed midway.
    const list = await (await page.request.get(`/api/v1/labs/${lab.labId}/members?pageSize=100`)).json();
    const sci = list.items.find((m: { email: string }) => m.email === DEMO.scientist.email);
    if (sci && sci.role !== "scientist")
      await page.request.patch(`/api/v1/labs/${lab.labId}/members/${sci.id}`, {
        headers: { origin: BASE_URL },
        data: { role: "scientist" },
      });
  }
});

test("the only lab manager cannot demote themselves", async ({ lab, page }) => {
  const members = await lab.open(MembersPage);
  const mine = members.roleOf(DEMO.manager.email);
  await expect(mine).toHaveValue("manager");
  expect(await members.chooseRole(DEMO.manager.email, "Bench scientist")).toBe(409);
  await expect(members.error).toHaveText(
    "a lab must keep at least one lab manager: make someone else lab manager first",
  );
  // The table refetches and shows the unchanged role; the nav still has the manager's pages.
  await expect(mine).toHaveValue("manager");
  await page.reload();
  await expect(members.currentRole).toHaveText("Lab manager");
  await expect(members.roleOf(DEMO.manager.email)).toHaveValue("manager");
});
