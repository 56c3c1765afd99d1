/** Someone in two labs switches between them with the lab switcher. */
import { expect, test } from "@playwright/test";
import { unique, uniqueEmail } from "./support/demo";
import { DASHBOARD_URL, labIdOf, signUp } from "./support/session";
import { AccountPage } from "./pages/account-page";
import { AuditPage } from "./pages/audit-page";
import { DashboardPage } from "./pages/dashboard-page";

test("a second lab from the account page, then switching between the two", async ({ page }) => {
  const first = unique("Scale Lab");
  const second = unique("Tooth Row Lab");
  const firstId = await signUp(page, {
    name: "Ada Quill",
    email: uniqueEmail("twolabs"),
    password: "two-labs-password",
    labName: first,
  });

  await new DashboardPage(page, firstId).accountLink.click();
  await expect(page).toHaveURL("/account");
  const account = new AccountPage(page);
  await expect(account.myLabs).toHaveText(`${first}Lab manager`);
  await account.createLab(second);
  await expect(page).toHaveURL(DASHBOARD_URL);
  const secondId = labIdOf(page);
  expect(secondId).not.toBe(firstId);
  const dashboard = new DashboardPage(page, secondId);
  await dashboard.expectHeading(second);
  await expect(dashboard.currentRole).toHaveText("Lab manager");

  const switcher = dashboard.labSwitcher;
  await expect(switcher).toHaveValue(secondId);
  await expect(switcher.locator("option")).toHaveText([first, second].sort((a, b) => a.localeCompare(b)));

  await switcher.selectOption({ label: first });
  await expect(page).toHaveURL(`/labs/${firstId}`);
  await dashboard.expectHeading(first);
  await expect(switcher).toHaveValue(firstId);

  await switcher.selectOption({ label: second });
  await expect(page).toHaveURL(`/labs/${secondId}`);
  await dashboard.expectHeading(second);

  // Each lab's audit trail records only its own creation.
  const audit = new AuditPage(page, firstId);
  await audit.goto();
  await expect(audit.table.root).toContainText(`created the lab “${first}”`);
  await expect(audit.table.root).not.toContainText(second);
});
