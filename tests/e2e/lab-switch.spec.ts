/** Someone in two labs switches between them with the lab switcher. */
import { expect, test } from "@playwright/test";
import { unique, uniqueEmail } from "./support/demo";
import { DASHBOARD_URL, labIdOf, signUp } from "./support/session";

test("a second lab from the account page, then switching between the two", async ({ page }) => {
  const first = unique("Scale Lab");
  const second = unique("Tooth Row Lab");
  const firstId = await signUp(page, {
    name: "Ada Quill",
    email: uniqueEmail("twolabs"),
    password: "two-labs-password",
    labName: first,
  });

  await page.getByTestId("account-link").click();
  await expect(page).toHaveURL("/account");
  await expect(page.getByTestId("my-labs")).toHaveText(`${first}Lab manager`);
  await page.getByLabel("Start another lab").fill(second);
  await page.getByTestId("create-lab").click();
  await expect(page).toHaveURL(DASHBOARD_URL);
  const secondId = labIdOf(page);
  expect(secondId).not.toBe(firstId);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(second);
  await expect(page.getByTestId("current-role")).toHaveText("Lab manager");

  const switcher = page.getByTestId("lab-switcher");
  await expect(switcher).toHaveValue(secondId);
  await expect(switcher.locator("option")).toHaveText([first, second].sort((a, b) => a.localeCompare(b)));

  await switcher.selectOption({ label: first });
  await expect(page).toHaveURL(`/labs/${firstId}`);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(first);
  await expect(switcher).toHaveValue(firstId);

  await switcher.selectOption({ label: second });
  await expect(page).toHaveURL(`/labs/${secondId}`);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(second);

  // Each lab's audit trail records only its own creation.
  await page.goto(`/labs/${firstId}/audit`);
  await expect(page.getByTestId("audit-table")).toContainText(`created the lab “${first}”`);
  await expect(page.getByTestId("audit-table")).not.toContainText(second);
});
