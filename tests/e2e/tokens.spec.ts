/** A personal API token: shown once, works as Bearer, expires after 90 days unless chosen otherwise, stops working when revoked. */
import { expect, test } from "@playwright/test";
import { BASE_URL, DEMO, DEMO_LAB, unique } from "./support/demo";
import { signIn } from "./support/session";

const me = (secret: string) => fetch(`${BASE_URL}/api/v1/me`, { headers: { authorization: `Bearer ${secret}` } });

test("create a token, call the API with it, revoke it", async ({ page }) => {
  await signIn(page, DEMO.modeller.email);
  await page.goto("/account");
  const name = unique("batch readouts");
  await page.getByLabel("Token name").fill(name);
  await expect(page.getByLabel("Expires after")).toHaveValue("90"); // the default lifetime, days
  await page.getByTestId("create-token").click();

  const shown = page.getByTestId("token-secret");
  await expect(shown).toContainText("it is shown only once");
  const secret = (await shown.locator("code").textContent())!.trim();
  expect(secret.length).toBeGreaterThanOrEqual(20);
  const row = page.getByTestId("tokens-table").getByRole("row").filter({ hasText: name });
  await expect(row).toContainText("active");
  await expect(row).toContainText("never");
  // Expires 90 days from now (either side of midnight UTC while the test runs).
  const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);
  const created = Date.now();
  await expect(row.locator("td").nth(4)).toHaveText(
    new RegExp(`^(${day(created + 90 * 86_400_000 - 60_000)}|${day(created + 90 * 86_400_000 + 60_000)})$`),
  );
  // The list shows only the start of the secret.
  await expect(row.locator("td").nth(1)).toHaveText(/^.+…$/);
  const prefix = (await row.locator("td").nth(1).textContent())!.replace("…", "");
  expect(secret.startsWith(prefix)).toBe(true);
  expect(prefix.length).toBeLessThan(secret.length);

  const ok = await me(secret);
  expect(ok.status).toBe(200);
  const body = await ok.json();
  expect(body.email).toBe(DEMO.modeller.email);
  expect(body.labs.map((l: { name: string; role: string }) => [l.name, l.role])).toContainEqual([DEMO_LAB, "modeller"]);
  expect((await me(`${secret}x`)).status).toBe(401);

  // Shown once: after a reload only the prefix remains, and "last used" is filled in.
  await page.reload();
  await expect(page.getByTestId("token-secret")).toHaveCount(0);
  await expect(page.locator("body")).not.toContainText(secret);
  await expect(row).not.toContainText("never");

  await row.getByRole("button", { name: "Revoke" }).click();
  await expect(row).toContainText("revoked");
  const gone = await me(secret);
  expect(gone.status).toBe(401);
  expect((await gone.json()).error.code).toBe("unauthenticated");
});
