/** A modeller analyses the Schnakenberg kinetics, writes a lab kinetics (typo first), and a collaborator only reads. */
import { expect, test } from "@playwright/test";
import { DEMO, unique } from "./support/demo";
import { signIn } from "./support/session";

test("Schnakenberg: classification, wavelength with unit, and a parameter change moves the number", async ({
  page,
}) => {
  const labId = await signIn(page, DEMO.modeller.email);
  await page.goto(`/labs/${labId}/kinetics`);
  await page.getByTestId("catalogue-table").getByRole("link", { name: "Schnakenberg" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Schnakenberg");

  // Defaults a = 0.1, b = 0.9, d = 20 are above d_c ≈ 8.57 (Murray 2003 §2.4): Turing.
  await expect(page.getByTestId("classification")).toHaveText("Turing");
  await page.getByTestId("length-scale").fill("10");
  const wavelength = page.getByTestId("predicted-wavelength");
  await expect(wavelength).toContainText("µm");
  await expect(wavelength).toContainText("model length");
  const before = await wavelength.textContent();
  await expect(page.getByTestId("dispersion-plot")).toBeVisible();
  await expect(page.getByTestId("turing-map")).toBeVisible();
  await expect(page.getByTestId("turing-fraction")).toContainText("%");

  await page.getByTestId("param-d").fill("40");
  await expect(wavelength).not.toHaveText(before ?? "");
  await expect(wavelength).toContainText("µm");
  await expect(page.getByTestId("dispersion-computing")).toHaveText("up to date");

  // Below d_c the state is stable and the page says so instead of a wavelength.
  await page.getByTestId("param-d").fill("5");
  await expect(page.getByTestId("classification")).toHaveText("stable");
  await expect(wavelength).toHaveText("—");

  // Out of range: the server's message names the parameter and its range.
  await page.getByTestId("param-a").fill("500");
  await expect(page.getByTestId("dispersion-error")).toHaveText(
    "Parameter a = 500 is outside its allowed range [0, 100].",
  );
});

test("a lab kinetics: a typo'd symbol is refused with the exact error, the fix saves version 1", async ({ page }) => {
  const labId = await signIn(page, DEMO.modeller.email);
  const name = unique("E2E activator");
  await page.goto(`/labs/${labId}/kinetics`);
  await page.getByTestId("new-kinetics").click();
  await page.getByTestId("kinetics-name").fill(name);
  await page.getByTestId("reaction-0").fill("a - u + u^2 * w");
  await page.getByTestId("reaction-1").fill("b - u^2 * v");
  await page.getByTestId("param-name-0").fill("a");
  await page.getByTestId("param-default-0").fill("0.1");
  await page.getByTestId("param-min-0").fill("0");
  await page.getByTestId("param-max-0").fill("10");
  for (const [i, [p, v, lo, hi]] of [
    ["b", "0.9", "0", "10"],
    ["d", "20", "1", "1000"],
  ].entries()) {
    await page.getByTestId("add-parameter").click();
    await page.getByTestId(`param-name-${i + 1}`).fill(p);
    await page.getByTestId(`param-default-${i + 1}`).fill(v);
    await page.getByTestId(`param-min-${i + 1}`).fill(lo);
    await page.getByTestId(`param-max-${i + 1}`).fill(hi);
  }
  await page.getByTestId("diffusion-1").fill("d");
  await page.getByTestId("save-kinetics").click();
  await expect(page.getByTestId("kinetics-error")).toHaveText(
    'definition.reactions[0]: unknown symbol "w" (species: u, v; parameters: a, b, d; constants: pi, e).',
  );

  await page.getByTestId("reaction-0").fill("a - u + u^2 * v");
  await page.getByTestId("save-kinetics").click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(name);
  await expect(page.getByTestId("kinetics-version")).toHaveText("Version 1");
  await expect(page.getByTestId("versions-table")).toContainText("v1");
  await expect(page.getByTestId("classification")).toHaveText("Turing");

  await page.goto(`/labs/${labId}/kinetics`);
  const row = page.getByTestId("lab-kinetics-table").getByRole("row").filter({ hasText: name });
  await expect(row).toContainText("v1");
  await expect(row).toContainText(DEMO.modeller.email);
});

test("a collaborator reads the catalogue but gets no New kinetics button", async ({ page }) => {
  const labId = await signIn(page, DEMO.collaborator.email);
  await page.goto(`/labs/${labId}/kinetics`);
  await expect(page.getByTestId("catalogue-table")).toContainText("Brusselator");
  await expect(page.getByTestId("new-kinetics")).toHaveCount(0);
  expect((await page.goto(`/labs/${labId}/kinetics/new`))?.status()).toBe(404);
});
