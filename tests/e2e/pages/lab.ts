/** A signed-in user inside one lab: the page and the page objects of that lab's pages. */
import type { Page } from "@playwright/test";
import { AccountPage } from "./account-page";
import { AuditPage } from "./audit-page";
import { DashboardPage } from "./dashboard-page";
import { FitBuilderPage } from "./fit-builder-page";
import { FitPage } from "./fit-page";
import { FitsPage } from "./fits-page";
import { KineticsEditorPage } from "./kinetics-editor-page";
import { KineticsListPage } from "./kinetics-list-page";
import { KineticsPage } from "./kinetics-page";
import type { LabPage } from "./lab-page";
import { MembersPage } from "./members-page";
import { ReadoutPage } from "./readout-page";
import { RunFormPage } from "./run-form-page";
import { RunPage } from "./run-page";
import { RunsPage } from "./runs-page";
import { SpecimenPage } from "./specimen-page";
import { StudiesPage } from "./studies-page";
import { StudyPage } from "./study-page";

type LabPageClass<P extends LabPage> = new (page: Page, labId: string) => P;

export class Lab {
  constructor(
    readonly page: Page,
    readonly labId: string,
  ) {}

  /** A page object for the page the browser is on (or is about to reach by a click). */
  on<P extends LabPage>(Kind: LabPageClass<P>): P {
    return new Kind(this.page, this.labId);
  }

  /** Opens a page by its own path and returns its page object. */
  async open<P extends LabPage>(Kind: LabPageClass<P>): Promise<P> {
    const p = this.on(Kind);
    await p.goto();
    return p;
  }

  dashboard = () => this.on(DashboardPage);
  studies = () => this.on(StudiesPage);
  study = () => this.on(StudyPage);
  specimen = () => this.on(SpecimenPage);
  readout = () => this.on(ReadoutPage);
  kineticsList = () => this.on(KineticsListPage);
  kinetics = () => this.on(KineticsPage);
  kineticsEditor = () => this.on(KineticsEditorPage);
  fits = () => this.on(FitsPage);
  fitBuilder = () => this.on(FitBuilderPage);
  fit = () => this.on(FitPage);
  runs = () => this.on(RunsPage);
  runForm = () => this.on(RunFormPage);
  run = () => this.on(RunPage);
  members = () => this.on(MembersPage);
  audit = () => this.on(AuditPage);
  account = () => new AccountPage(this.page);
}
