/**
 * The main path by keyboard only (Tab, Shift+Tab, Enter, Space, arrow keys, and typing into
 * fields): sign in → upload an image to a specimen → its readout starts → open the readout →
 * start a fit from it. Every element focus stops on shows a focus ring.
 */
import { encodePng } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";
import { DEMO, unique } from "./support/demo";
import { DASHBOARD_URL } from "./support/session";
import { expect, test } from "@playwright/test";
import { KeyboardPath } from "./pages/keyboard";
import { LoginPage } from "./pages/login-page";

// The seeded study and specimen (lib/cli/seed-demo.ts), written out on purpose. Not the placode
// study: readouts.spec.ts counts its uploads per condition.
const STUDY = "Palatal ridge stripes in two genotypes";
const SPECIMEN = "PR-21";

test("a bench scientist signs in, uploads, reads and starts a fit with the keyboard alone", async ({ page }) => {
  test.setTimeout(120_000);
  // Stripes of period 22 px at 2.0 µm/px: λ = 44 µm by construction (SCIENCE.md §5).
  const png = await encodePng(
    makeStripes({ width: 192, height: 192, wavelengthPx: 22, angleDeg: 20, noise: 0.1, seed: 7 }),
  );
  const filename = `${unique("keyboard-stripes")}.png`;
  const keys = new KeyboardPath(page);

  const login = new LoginPage(page);
  await login.goto();
  await keys.type(login.email, DEMO.scientist.email);
  await keys.type(login.password, "morphokin-demo");
  await page.keyboard.press("Enter");
  await expect(page).toHaveURL(DASHBOARD_URL);

  await keys.activate(page.getByRole("navigation", { name: "Lab" }).getByRole("link", { name: "Studies" }));
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Studies");
  await keys.activate(page.getByTestId("studies-table").getByRole("link", { name: STUDY }));
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(STUDY);
  await keys.activate(page.getByTestId("specimens-table").getByRole("link", { name: SPECIMEN }));
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(`Specimen ${SPECIMEN}`);

  // The file input opens the system's file dialog on Space; the test stands in for the person choosing.
  await keys.tabTo(page.getByTestId("upload-file"));
  const [chooser] = await Promise.all([page.waitForEvent("filechooser"), page.keyboard.press("Space")]);
  await chooser.setFiles({ name: filename, mimeType: "image/png", buffer: png });
  await keys.type(page.getByLabel(/^Pixel size/), "2.0");
  await keys.activate(page.getByTestId("upload-submit"));
  await expect(page.getByTestId("upload-message")).toContainText(`Stored “${filename}”`);

  // Every upload is read on arrival: its readout row appears; open it.
  const row = page.getByTestId("readout-row").filter({ hasText: filename });
  await expect(row).toHaveCount(1, { timeout: 30_000 });
  await keys.activate(row.getByTestId("open-readout"));
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(`Readout of ${filename}`);
  await expect(page.getByTestId("readout-wavelength")).toContainText("µm", { timeout: 60_000 });

  await keys.activate(page.getByTestId("fit-from-readout"));
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("New fit");
  // The readout arrives picked; the kinetics (Schnakenberg) has a length scale and one free parameter.
  const pick = page.getByRole("checkbox", { name: `use ${filename}`, exact: true });
  await expect(pick).toBeChecked();
  await keys.type(page.getByTestId("model-0-length-scale"), "40");
  await keys.tabTo(page.getByTestId("mode-gamma"));
  await page.keyboard.press("ArrowDown");
  await expect(page.getByTestId("mode-gamma")).toHaveValue("free");
  await keys.type(page.getByTestId("fit-name"), unique("Keyboard fit"));
  await keys.activate(page.getByTestId("start-fit"));
  await expect(page).toHaveURL(/\/fits\/[0-9a-f-]{36}$/, { timeout: 30_000 });
  await expect(page.getByTestId("fit-caution")).toBeVisible();

  expect(keys.visited.length).toBeGreaterThan(10);
  await page.screenshot({ path: "test-results/keyboard-fit.png" });
});
