/** The manager changes roles; the last lab manager cannot demote themselves. */
import { expect, test, type Page } from "@playwright/test";
import { BASE_URL, DEMO } from "./support/demo";
import { signIn } from "./support/session";

async function setRole(page: Page, email: string, label: string, value: string) {
  const select = page.getByTestId(`role-${email}`);
  const patched = page.waitForResponse((r) => r.request().method() === "PATCH" && r.url().includes("/members/"));
  await select.selectOption({ label });
  expect((await patched).status()).toBe(200);
  await expect(select).toHaveValue(value);
}

async function auditSummaries(page: Page, labId: string, filter: string): Promise<string[]> {
  await page.goto(`/labs/${labId}/audit`);
  const table = page.getByTestId("audit-table");
  await table.getByLabel("Filter rows").fill(filter);
  await expect(table.locator("tbody tr").first()).toContainText(filter);
  return table.locator("tbody tr td:nth-child(4)").allTextContents();
}

test("the manager changes a member's role and back; the audit trail records both", async ({ page }) => {
  const labId = await signIn(page, DEMO.manager.email);
  try {
    await page.goto(`/labs/${labId}/members`);
    await setRole(page, DEMO.scientist.email, "Collaborator", "collaborator");
    await page.reload();
    await expect(page.getByTestId(`role-${DEMO.scientist.email}`)).toHaveValue("collaborator");

    await setRole(page, DEMO.scientist.email, "Bench scientist", "scientist");
    await page.reload();
    await expect(page.getByTestId(`role-${DEMO.scientist.email}`)).toHaveValue("scientist");

    const summaries = await auditSummaries(page, labId, `changed ${DEMO.scientist.email}`);
    // Newest first.
    expect(summaries.slice(0, 2)).toEqual([
      `${DEMO.manager.email} changed ${DEMO.scientist.email} from Collaborator to Bench scientist`,
      `${DEMO.manager.email} changed ${DEMO.scientist.email} from Bench scientist to Collaborator`,
    ]);
  } finally {
    // Leave the demo lab as seeded for the other specs, even when an assertion failed midway.
    const members = await (await page.request.get(`/api/v1/labs/${labId}/members?pageSize=100`)).json();
    const sci = members.items.find((m: { email: string }) => m.email === DEMO.scientist.email);
    if (sci && sci.role !== "scientist")
      await page.request.patch(`/api/v1/labs/${labId}/members/${sci.id}`, {
        headers: { origin: BASE_URL },
        data: { role: "scientist" },
      });
  }
});

test("the only lab manager cannot demote themselves", async ({ page }) => {
  const labId = await signIn(page, DEMO.manager.email);
  await page.goto(`/labs/${labId}/members`);
  const mine = page.getByTestId(`role-${DEMO.manager.email}`);
  await expect(mine).toHaveValue("manager");
  const patched = page.waitForResponse((r) => r.request().method() === "PATCH" && r.url().includes("/members/"));
  await mine.selectOption({ label: "Bench scientist" });
  expect((await patched).status()).toBe(409);
  await expect(page.getByTestId("members-error")).toHaveText(
    "a lab must keep at least one lab manager: make someone else lab manager first",
  );
  // The table refetches and shows the unchanged role; the nav still has the manager's pages.
  await expect(mine).toHaveValue("manager");
  await page.reload();
  await expect(page.getByTestId("current-role")).toHaveText("Lab manager");
  await expect(page.getByTestId(`role-${DEMO.manager.email}`)).toHaveValue("manager");
});
