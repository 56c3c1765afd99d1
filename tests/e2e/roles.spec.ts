/** Each demo role signs in through the form and sees what its role allows, and no more. */
import { expect, test, type Page } from "@playwright/test";
import { DEMO, DEMO_LAB, type DemoRole } from "./support/demo";
import { navLabels, signIn } from "./support/session";

interface Expectation {
  role: DemoRole;
  managerNav: boolean;
  canCreate: boolean;
}

// From lib/access/permissions.ts as the product guide states it: only the lab manager reads the
// audit trail and the mailbox and manages members; everyone but the collaborator creates.
const ROLES: Expectation[] = [
  { role: "manager", managerNav: true, canCreate: true },
  { role: "scientist", managerNav: false, canCreate: true },
  { role: "modeller", managerNav: false, canCreate: true },
  { role: "collaborator", managerNav: false, canCreate: false },
];

async function firstSpecimenPath(page: Page, labId: string): Promise<string> {
  const studies = await (await page.request.get(`/api/v1/labs/${labId}/studies?sort=name&dir=asc`)).json();
  const study = studies.items.find((s: { name: string }) => s.name.startsWith("Dorsal placode"));
  const specimens = await (
    await page.request.get(`/api/v1/labs/${labId}/studies/${study.id}/specimens?sort=label&dir=asc`)
  ).json();
  expect(specimens.items[0].label).toBe("DS-01");
  return `/labs/${labId}/specimens/${specimens.items[0].id}`;
}

for (const { role, managerNav, canCreate } of ROLES) {
  test(`${role}: dashboard, navigation and what the pages offer`, async ({ page }) => {
    const { email, label } = DEMO[role];
    const labId = await signIn(page, email);

    await expect(page.getByRole("heading", { level: 1 })).toHaveText(DEMO_LAB);
    await expect(page.getByTestId("current-role")).toHaveText(label);
    await expect(page.getByTestId("lab-switcher")).toHaveValue(labId);

    const nav = await navLabels(page);
    expect(nav.slice(0, 7)).toEqual(["Dashboard", "Studies", "Readouts", "Kinetics", "Fits", "Runs", "Members"]);
    expect(nav.includes("Audit trail")).toBe(managerNav);
    expect(nav.includes("Mailbox (dev)")).toBe(managerNav);

    // Studies: the "New study" button only for roles that may create.
    await page.goto(`/labs/${labId}/studies`);
    await expect(page.getByTestId("studies-table").getByRole("link", { name: /^Palatal ridge stripes/ })).toBeVisible();
    await expect(page.getByTestId("new-study")).toHaveCount(canCreate ? 1 : 0);

    // A specimen: the upload form only for roles that may upload; the seeded file is listed for all.
    await page.goto(await firstSpecimenPath(page, labId));
    await expect(page.getByRole("heading", { level: 1 })).toHaveText("Specimen DS-01");
    await expect(page.getByTestId("uploads-table").getByTestId("download-link")).toHaveText("placodes-1.tif");
    await expect(page.getByTestId("upload-form")).toHaveCount(canCreate ? 1 : 0);

    // The audit trail answers not-found to everyone but the manager.
    const audit = await page.goto(`/labs/${labId}/audit`);
    if (managerNav) {
      expect(audit?.status()).toBe(200);
      await expect(page.getByRole("heading", { level: 1 })).toHaveText("Audit trail");
      await expect(page.getByTestId("audit-table")).toContainText(
        "created the lab “Bracken Hill Patterning Lab” with four members",
      );
    } else {
      expect(audit?.status()).toBe(404);
      await expect(page.getByTestId("not-found")).toBeVisible();
      await expect(page.getByTestId("audit-table")).toHaveCount(0);
    }

    // Members: the manager gets a role select per member, everyone else read-only badges.
    await page.goto(`/labs/${labId}/members`);
    const table = page.getByTestId("members-table");
    for (const other of Object.values(DEMO)) await expect(table).toContainText(other.email);
    const selects = table.locator("select");
    const rows = table.locator("tbody tr");
    if (managerNav) {
      // One select per member row (other specs may have added members to the demo lab).
      await expect(selects).toHaveCount(await rows.count());
      for (const [r, p] of Object.entries(DEMO)) await expect(table.getByTestId(`role-${p.email}`)).toHaveValue(r);
      await expect(page.getByTestId("invite-form")).toBeVisible();
    } else {
      await expect(selects).toHaveCount(0);
      const scientistRow = table.getByRole("row").filter({ hasText: DEMO.scientist.email });
      await expect(scientistRow).toContainText("Bench scientist");
      await expect(page.getByTestId("invite-form")).toHaveCount(0);
    }
  });
}
