import { expect, type Locator, type Page } from "@playwright/test";
import { DataTable } from "./data-table";
import { LabPage } from "./lab-page";

export class MembersPage extends LabPage {
  readonly table: DataTable;
  readonly roleSelects: Locator;
  readonly inviteForm: Locator;
  readonly error: Locator;
  readonly invitations: DataTable;
  readonly inviteMessage: Locator;
  /** Asks before a role changes and says what the new role may do. */
  readonly roleDialog: Locator;

  constructor(page: Page, labId: string) {
    super(page, labId);
    this.table = new DataTable(page.getByTestId("members-table"));
    this.roleSelects = this.table.root.locator("select");
    this.inviteForm = page.getByTestId("invite-form");
    this.error = page.getByTestId("members-error");
    this.invitations = new DataTable(page.getByTestId("invitations-table"));
    this.inviteMessage = page.getByTestId("invite-message");
    this.roleDialog = page.getByTestId("role-change-dialog");
  }

  override get path() {
    return "/members";
  }

  async invite(email: string, roleLabel: string) {
    await this.inviteForm.getByLabel(/^E-mail/).fill(email);
    await this.inviteForm.getByLabel(/^Role/).selectOption({ label: roleLabel });
    await this.page.getByTestId("send-invitation").click();
  }

  revokeButton(email: string): Locator {
    return this.page.getByTestId(`revoke-${email}`);
  }

  roleOf(email: string): Locator {
    return this.page.getByTestId(`role-${email}`);
  }

  /** Picks a role by its label; the confirmation dialog opens and nothing is sent yet. */
  async pickRole(email: string, label: string) {
    await this.roleOf(email).selectOption({ label });
    await expect(this.roleDialog).toBeVisible();
  }

  /** Picks a role by its label, confirms it in the dialog and returns the status the server answered with. */
  async chooseRole(email: string, label: string): Promise<number> {
    await this.pickRole(email, label);
    const patched = this.page.waitForResponse((r) => r.request().method() === "PATCH" && r.url().includes("/members/"));
    await this.roleDialog.getByTestId("role-change-confirm").click();
    return (await patched).status();
  }

  async cancelRoleChange() {
    await this.roleDialog.getByTestId("role-change-cancel").click();
    await expect(this.roleDialog).toBeHidden();
  }

  /** Changes a role and checks the server took it. */
  async setRole(email: string, label: string, value: string) {
    expect(await this.chooseRole(email, label)).toBe(200);
    await expect(this.roleOf(email)).toHaveValue(value);
  }
}
