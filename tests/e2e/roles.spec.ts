/** Each demo role signs in through the form and sees what its role allows, and no more. */
import type { Page } from "@playwright/test";
import { DEMO, DEMO_LAB, type DemoRole } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { AuditPage } from "./pages/audit-page";
import { DashboardPage } from "./pages/dashboard-page";
import { MembersPage } from "./pages/members-page";
import { SpecimenPage } from "./pages/specimen-page";
import { StudiesPage } from "./pages/studies-page";

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
  test.describe(role, () => {
    test.use({ role });

    test(`${role}: dashboard, navigation and what the pages offer`, async ({ lab, page }) => {
      const { label } = DEMO[role];
      const dashboard = lab.on(DashboardPage);

      await dashboard.expectHeading(DEMO_LAB);
      await expect(dashboard.currentRole).toHaveText(label);
      await expect(dashboard.labSwitcher).toHaveValue(lab.labId);

      const nav = await dashboard.navLabels();
      expect(nav.slice(0, 7)).toEqual(["Dashboard", "Studies", "Readouts", "Kinetics", "Fits", "Runs", "Members"]);
      expect(nav.includes("Audit trail")).toBe(managerNav);
      expect(nav.includes("Mailbox (dev)")).toBe(managerNav);

      // Studies: the "New study" button only for roles that may create.
      const studies = await lab.open(StudiesPage);
      await expect(studies.table.link(/^Palatal ridge stripes/)).toBeVisible();
      await expect(studies.newStudyButton).toHaveCount(canCreate ? 1 : 0);

      // A specimen: the upload form only for roles that may upload; the seeded file is listed for all.
      await page.goto(await firstSpecimenPath(page, lab.labId));
      const specimen = lab.on(SpecimenPage);
      await specimen.expectHeading("Specimen DS-01");
      await expect(specimen.uploads.root.getByTestId("download-link")).toHaveText("placodes-1.tif");
      await expect(specimen.uploadForm).toHaveCount(canCreate ? 1 : 0);

      // The audit trail is only the manager's; everyone else is told so (403, not "Not found").
      const audit = lab.on(AuditPage);
      const status = await audit.goto();
      if (managerNav) {
        expect(status).toBe(200);
        await audit.expectHeading("Audit trail");
        // Filtered: other tests' entries push the lab's first one off the first page.
        await audit.table.filter("created the lab");
        await expect(audit.table.root).toContainText("created the lab “Bracken Hill Patterning Lab” with four members");
      } else {
        expect(status).toBe(403);
        await expect(audit.roleRefusal).toHaveText("Only lab managers can read the audit trail.");
        await expect(audit.table.root).toHaveCount(0);
      }

      // Members: the manager gets a role select per member, everyone else read-only badges.
      const members = await lab.open(MembersPage);
      for (const other of Object.values(DEMO)) await expect(members.table.root).toContainText(other.email);
      if (managerNav) {
        // One select per member row (other specs may have added members to the demo lab).
        await expect(members.roleSelects).toHaveCount(await members.table.rows.count());
        for (const [r, p] of Object.entries(DEMO)) await expect(members.roleOf(p.email)).toHaveValue(r);
        await expect(members.inviteForm).toBeVisible();
      } else {
        await expect(members.roleSelects).toHaveCount(0);
        await expect(members.table.row(DEMO.scientist.email)).toContainText("Bench scientist");
        await expect(members.inviteForm).toHaveCount(0);
      }
    });
  });
}
