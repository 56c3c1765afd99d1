/**
 * When one API call fails (a 500, a dropped connection, a garbled answer), the page says so in plain
 * words with a way to try again — never a blank page or a stack trace. Failures are made by route
 * interception in the browser; the server stays healthy, so "Try again" can recover.
 */
import { expect, test } from "./pages/fixtures";
import { MembersPage } from "./pages/members-page";
import { StudiesPage } from "./pages/studies-page";

test.use({ role: "scientist" });

/** The list call of a section's table, not the page itself. */
const listCall = (labId: string, resource: string) => new RegExp(`/api/v1/labs/${labId}/${resource}\\?`);

test("a 500 from the studies list shows a plain message in the table, and Try again loads the rows", async ({
  lab,
  page,
}) => {
  await page.route(listCall(lab.labId, "studies"), (route) =>
    route.fulfill({ status: 500, contentType: "text/plain", body: "Internal Server Error" }),
  );
  const studies = await lab.open(StudiesPage);
  await studies.expectHeading("Studies");
  await expect(studies.table.error).toHaveText(
    "The rows could not be loaded: the server answered with an error (500). Try again in a moment.Try again",
  );
  await expect(studies.table.error).not.toContainText("Internal Server Error");

  await page.unroute(listCall(lab.labId, "studies"));
  await studies.table.retry();
  await expect(studies.table.error).toHaveCount(0);
  await expect(studies.table.link(/^Palatal ridge stripes/)).toBeVisible();
});

test("a dropped connection to the members list says the server could not be reached", async ({ lab, page }) => {
  await page.route(listCall(lab.labId, "members"), (route) => route.abort("connectionreset"));
  const members = await lab.open(MembersPage);
  await members.expectHeading(/Members/);
  await expect(members.table.error).toContainText(
    "The rows could not be loaded: the server could not be reached. Check the connection and try again.",
  );
});

test("a garbled answer breaks the studies page into its error boundary, and Try again recovers it", async ({
  lab,
  page,
}) => {
  // A 200 that is not a list (as a misconfigured proxy might send) makes the table throw while drawing.
  await page.route(listCall(lab.labId, "studies"), (route) =>
    route.fulfill({ status: 200, contentType: "application/json", body: "{}" }),
  );
  const studies = await lab.open(StudiesPage);
  await studies.expectErrorBoundary("the studies");
  // The header and navigation stay: the boundary wraps the section, not the lab layout.
  await expect(studies.nav).toBeVisible();
  await page.screenshot({ path: process.env.ERROR_SCREENSHOT ?? "test-results/error-boundary.png", fullPage: true });

  await page.unroute(listCall(lab.labId, "studies"));
  await studies.retryButton.click();
  await expect(studies.errorBoundary).toHaveCount(0);
  await studies.expectHeading("Studies");
  await expect(studies.table.link(/^Palatal ridge stripes/)).toBeVisible();
});
