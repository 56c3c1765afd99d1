/** A modeller analyses the Schnakenberg kinetics, writes a lab kinetics (typo first), and a collaborator only reads. */
import { DEMO, unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { KineticsEditorPage } from "./pages/kinetics-editor-page";
import { KineticsListPage } from "./pages/kinetics-list-page";
import { KineticsPage } from "./pages/kinetics-page";

test.describe("modeller", () => {
  test.use({ role: "modeller" });

  test("Schnakenberg: classification, wavelength with unit, and a parameter change moves the number", async ({
    lab,
  }) => {
    await (await lab.open(KineticsListPage)).openCatalogue("Schnakenberg");
    const k = lab.on(KineticsPage);
    await k.expectHeading("Schnakenberg");

    // Defaults a = 0.1, b = 0.9, d = 20 are above d_c ≈ 8.57 (Murray 2003 §2.4): Turing.
    await expect(k.classification).toHaveText("Turing");
    await k.lengthScale.fill("10");
    await expect(k.wavelength).toContainText("µm");
    await expect(k.wavelength).toContainText("model length");
    const before = await k.wavelength.textContent();
    await expect(k.dispersionPlot).toBeVisible();
    await expect(k.turingMap).toBeVisible();
    await expect(k.turingFraction).toContainText("%");

    await k.setParam("d", "40");
    await expect(k.wavelength).not.toHaveText(before ?? "");
    await expect(k.wavelength).toContainText("µm");
    await expect(k.dispersionComputing).toHaveText("up to date");

    // Below d_c the state is stable and the page says so instead of a wavelength.
    await k.setParam("d", "5");
    await expect(k.classification).toHaveText("stable");
    await expect(k.wavelength).toHaveText("—");

    // Out of range: the server's message names the parameter and its range.
    await k.setParam("a", "500");
    await expect(k.dispersionError).toHaveText("Parameter a = 500 is outside its allowed range [0, 100].");
  });

  test("a lab kinetics: a typo'd symbol is refused with the exact error, the fix saves version 1", async ({ lab }) => {
    const name = unique("E2E activator");
    const list = await lab.open(KineticsListPage);
    await list.newKineticsButton.click();
    const editor = lab.on(KineticsEditorPage);
    await editor.setName(name);
    await editor.setReaction(0, "a - u + u^2 * w");
    await editor.setReaction(1, "b - u^2 * v");
    await editor.setParameters([
      { name: "a", default: "0.1", min: "0", max: "10" },
      { name: "b", default: "0.9", min: "0", max: "10" },
      { name: "d", default: "20", min: "1", max: "1000" },
    ]);
    await editor.setDiffusion(1, "d");
    await editor.save();
    await expect(editor.error).toHaveText(
      'Equation for du/dt: unknown symbol "w" (species: u, v; parameters: a, b, d; constants: pi, e).',
    );

    await editor.setReaction(0, "a - u + u^2 * v");
    await editor.save();
    const k = lab.on(KineticsPage);
    await k.expectHeading(name);
    await expect(k.version).toHaveText("Version 1");
    await expect(k.versions).toContainText("v1");
    await expect(k.classification).toHaveText("Turing");

    await list.goto();
    const row = list.labKinetics.row(name);
    await expect(row).toContainText("v1");
    await expect(row).toContainText(DEMO.modeller.email);
  });
});

test.describe("collaborator", () => {
  test.use({ role: "collaborator" });

  test("a collaborator reads the catalogue but gets no New kinetics button", async ({ lab, page }) => {
    const list = await lab.open(KineticsListPage);
    await expect(list.catalogue.root).toContainText("Brusselator");
    await expect(list.newKineticsButton).toHaveCount(0);
    expect((await page.goto(`/labs/${lab.labId}/kinetics/new`))?.status()).toBe(403);
    await expect(page.getByTestId("role-refusal")).toHaveText(
      "Collaborators can read and analyse kinetics but not define or edit them.",
    );
  });
});
