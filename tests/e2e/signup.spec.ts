/** Creating an account with its lab, the duplicate-address error, and a wrong password. */
import { expect, test } from "@playwright/test";
import { DEMO, DEMO_LAB, DEMO_PASSWORD, unique, uniqueEmail } from "./support/demo";
import { fillSignup, signIn, signUp } from "./support/session";

test("sign-up creates the account and a lab, and lands on it as lab manager", async ({ page }) => {
  const account = { name: "Rowan Teale", email: uniqueEmail("signup"), password: "placode-spacing-42", labName: unique("Feather Tract Group") };
  const labId = await signUp(page, account);

  await expect(page.getByRole("heading", { level: 1 })).toHaveText(account.labName);
  await expect(page.getByText("You are lab manager here.")).toBeVisible();
  await expect(page.getByTestId("current-role")).toHaveText("Lab manager");
  await expect(page.getByTestId("account-link")).toHaveText(account.name);
  await expect(page.getByTestId("lab-switcher").locator("option")).toHaveText([account.labName]);
  await expect(page.getByRole("navigation", { name: "Lab" }).getByRole("link", { name: "Audit trail" })).toHaveAttribute("href", `/labs/${labId}/audit`);

  // The lab is empty and says what to do next.
  await expect(page.getByTestId("empty-state").first()).toContainText("No studies yet.");

  // The session is real: the API knows who this is.
  const me = await (await page.request.get("/api/v1/me")).json();
  expect(me.email).toBe(account.email);
  expect(me.labs).toEqual([{ id: labId, name: account.labName, role: "manager" }]);
});

test("signing up again with an address that has an account is refused with a clear message", async ({ page }) => {
  await page.goto("/signup");
  await fillSignup(page, { name: "Someone Else", email: DEMO.scientist.email, password: "another-password-1", labName: unique("Duplicate Lab") });
  await page.getByTestId("create-account").click();
  await expect(page.getByTestId("signup-error")).toHaveText(`an account with the e-mail ${DEMO.scientist.email} already exists; sign in instead`);
  await expect(page).toHaveURL(/\/signup$/);

  expect((await page.request.get("/api/v1/me")).status()).toBe(401);

  // The existing account is untouched: same password, still only the demo lab.
  await signIn(page, DEMO.scientist.email);
  await expect(page.getByTestId("lab-switcher").locator("option")).toHaveText([DEMO_LAB]);
});

test("a wrong password on the sign-in form says so and stays on the form", async ({ page }) => {
  await page.goto("/login");
  await page.getByLabel(/^E-mail$/).fill(DEMO.manager.email);
  await page.getByLabel(/^Password/).fill(`${DEMO_PASSWORD}-wrong`);
  await page.getByTestId("sign-in").click();
  await expect(page.getByTestId("login-error")).toHaveText("Wrong e-mail or password.");
  await expect(page).toHaveURL(/\/login$/);
  expect((await page.request.get("/api/v1/me")).status()).toBe(401);
});
