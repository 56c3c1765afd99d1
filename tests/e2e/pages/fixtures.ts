/**
 * `test` for browser specs: `test.use({ role: "modeller" })` and the `lab` fixture is the page
 * signed in as that demo role, with the lab's page objects; `signInAs(role)` signs someone else in
 * within a fresh browser context that is closed after the test.
 */
import { test as base } from "@playwright/test";
import { DEMO, type DemoRole } from "../support/demo";
import { signIn } from "../support/session";
import { Lab } from "./lab";

export interface LabFixtures {
  /** The demo role `lab` signs in as. */
  role: DemoRole;
  lab: Lab;
  signInAs: (role: DemoRole) => Promise<Lab>;
}

// Playwright names the second fixture argument `use`; it is called `provide` here so the React
// hooks lint rule does not take it for a hook.
export const test = base.extend<LabFixtures>({
  role: ["scientist", { option: true }],
  lab: async ({ page, role }, provide) => {
    await provide(new Lab(page, await signIn(page, DEMO[role].email)));
  },
  signInAs: async ({ browser }, provide) => {
    const contexts: Awaited<ReturnType<typeof browser.newContext>>[] = [];
    await provide(async (role) => {
      const context = await browser.newContext();
      contexts.push(context);
      const page = await context.newPage();
      return new Lab(page, await signIn(page, DEMO[role].email));
    });
    for (const c of contexts) await c.close();
  },
});

export { expect } from "@playwright/test";
