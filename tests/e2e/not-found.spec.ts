/**
 * An id that names nothing in the lab answers a real 404 page, also on the pages that stream a
 * loading skeleton (the status must be decided before the first byte). Common practice, no source.
 */
import { expect, test } from "./pages/fixtures";

test.use({ role: "scientist" });

const NOBODY = "00000000-0000-4000-8000-000000000000";

for (const path of [
  `studies/${NOBODY}`,
  `specimens/${NOBODY}`,
  `readouts/${NOBODY}`,
  `fits/${NOBODY}`,
  `runs/${NOBODY}`,
  `kinetics/${NOBODY}`,
  `kinetics/${NOBODY}/edit`,
  "kinetics/no-such-kinetics",
]) {
  test(`/labs/…/${path} is a 404 with the not-found page`, async ({ lab, page }) => {
    const res = await page.goto(`/labs/${lab.labId}/${path}`);
    expect(res?.status()).toBe(404);
    await expect(page.getByTestId("not-found")).toBeVisible();
  });
}
