/** A personal API token: shown once, works as Bearer, expires after 90 days unless chosen otherwise, stops working when revoked. */
import { BASE_URL, DEMO, DEMO_LAB, unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";

const me = (secret: string) => fetch(`${BASE_URL}/api/v1/me`, { headers: { authorization: `Bearer ${secret}` } });

test.use({ role: "modeller" });

test("create a token, call the API with it, revoke it", async ({ lab, page }) => {
  const account = lab.account();
  await account.goto();
  const name = unique("batch readouts");
  await account.tokenName.fill(name);
  await expect(account.tokenExpiry).toHaveValue("90"); // the default lifetime, days
  await account.createToken(name);

  await expect(account.tokenSecret).toContainText("it is shown only once");
  const secret = await account.shownSecret();
  expect(secret.length).toBeGreaterThanOrEqual(20);
  const row = account.tokens.row(name);
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

  // A lab's list asked again and again (an API script polling): each answer the same, with the
  // API's security headers, whether the route made it or the web process gave it again from the
  // kept answers (lib/cli/front-door.ts).
  const labId = (body.labs as { id: string; name: string }[]).find((l) => l.name === DEMO_LAB)!.id;
  const studies = () =>
    fetch(`${BASE_URL}/api/v1/labs/${labId}/studies`, { headers: { authorization: `Bearer ${secret}` } });
  const answers = [];
  for (let i = 0; i < 4; i++) answers.push(await studies());
  const texts = await Promise.all(answers.map((a) => a.text()));
  expect(answers.map((a) => a.status)).toEqual([200, 200, 200, 200]);
  expect(new Set(texts).size).toBe(1);
  for (const a of answers) {
    expect(a.headers.get("content-security-policy")).toContain("default-src 'none'");
    expect(a.headers.get("x-frame-options")).toBe("DENY");
    expect(a.headers.get("content-type")).toBe("application/json");
  }

  // Shown once: after a reload only the prefix remains, and "last used" is filled in.
  await page.reload();
  await expect(account.tokenSecret).toHaveCount(0);
  await expect(page.locator("body")).not.toContainText(secret);
  await expect(row).not.toContainText("never");

  await account.revoke(name);
  await expect(row).toContainText("revoked");
  const gone = await me(secret);
  expect(gone.status).toBe(401);
  expect((await gone.json()).error.code).toBe("unauthenticated");
  // The revocation ends the kept answers of the token at once, in every web process.
  for (let i = 0; i < 4; i++) expect((await studies()).status).toBe(401);
});
