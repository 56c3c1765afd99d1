/** A role change asks first, in a dialog that says what the new role may do; Cancel sends nothing. */
import { BASE_URL, DEMO } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { MembersPage } from "./pages/members-page";

test.use({ role: "manager" });

test("the lab manager confirms a role change in a dialog that says what the new role may do", async ({ lab, page }) => {
  try {
    const members = await lab.open(MembersPage);
    const patches: string[] = [];
    page.on("request", (r) => {
      if (r.method() === "PATCH" && r.url().includes("/members/")) patches.push(r.url());
    });

    await members.pickRole(DEMO.scientist.email, "Collaborator");
    await expect(members.roleDialog.getByRole("heading")).toHaveText(`Make ${DEMO.scientist.email} a Collaborator?`);
    // PRODUCT.md, "Who uses it": a collaborator may read everything in the lab and comment; nothing else.
    await expect(members.roleDialog).toContainText(
      "Now Bench scientist. As Collaborator they may: read everything in the lab, comment; nothing else.",
    );
    await page.screenshot({ path: "/tmp/accounts-role-dialog.png" });
    await members.cancelRoleChange();
    expect(patches).toEqual([]);
    await expect(members.roleOf(DEMO.scientist.email)).toHaveValue("scientist");

    await members.pickRole(DEMO.scientist.email, "Modeller");
    await expect(members.roleDialog).toContainText(
      "As Modeller they may: everything a bench scientist may, plus defining and editing kinetics, verification runs.",
    );
    await page.keyboard.press("Escape");
    await expect(members.roleDialog).toBeHidden();
    expect(patches).toEqual([]);

    expect(await members.chooseRole(DEMO.scientist.email, "Collaborator")).toBe(200);
    await page.reload();
    await expect(members.roleOf(DEMO.scientist.email)).toHaveValue("collaborator");
  } finally {
    // Leave the demo lab as seeded for the other specs, even when an assertion failed midway.
    const list = await (await page.request.get(`/api/v1/labs/${lab.labId}/members?pageSize=100`)).json();
    const sci = list.items.find((m: { email: string }) => m.email === DEMO.scientist.email);
    if (sci && sci.role !== "scientist")
      await page.request.patch(`/api/v1/labs/${lab.labId}/members/${sci.id}`, {
        headers: { origin: BASE_URL },
        data: { role: "scientist" },
      });
  }
});
