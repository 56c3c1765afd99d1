/**
 * A study comparison whose confidence interval is far wider than the data: the whisker stays inside
 * the chart's axes, and each end cut off is marked with an arrow and its value. As a bench
 * scientist, with spacing tables made through the API (one per specimen, two specimens per condition).
 *
 * Check values, worked by hand: condition "uneven" has specimen means 30 and 40 µm, so mean 35,
 * SD 7.0711, SE 5; its 95 % CI of the mean is 35 ± t(0.975, 1) · 5 = 35 ± 12.706 · 5 = −28.53 … 98.53 µm
 * (t quantile from the NIST/SEMATECH e-Handbook of Statistical Methods, table 1.3.6.7.2).
 * Condition "even" has 35 and 36 µm. The axis may stretch past the values (30…40) by one span on
 * each side (components/charts/clip-interval.ts), so both ends of "uneven" are cut off.
 */
import type { Page } from "@playwright/test";
import { BASE_URL, unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { StudyPage } from "./pages/study-page";

test.use({ role: "scientist" });

/** A table of 12 equal spacings of `spacingUm` (µm), as a bench scientist would export it. */
function spacingTable(spacingUm: number): Buffer {
  return Buffer.from(`spacing_um\n${Array.from({ length: 12 }, () => spacingUm.toFixed(1)).join("\n")}\n`);
}

async function seedStudy(page: Page, labId: string) {
  const headers = { origin: BASE_URL };
  const name = unique("Whisker study");
  const study = await page.request.post(`/api/v1/labs/${labId}/studies`, {
    headers,
    data: { name, tissue: "dorsal skin", organism: "chick" },
  });
  expect(study.status()).toBe(201);
  const studyId = (await study.json()).id as string;
  const plan: [string, string, number][] = [
    ["WS-1", "uneven", 30],
    ["WS-2", "uneven", 40],
    ["WS-3", "even", 35],
    ["WS-4", "even", 36],
  ];
  for (const [label, condition, spacingUm] of plan) {
    const specimen = await page.request.post(`/api/v1/labs/${labId}/studies/${studyId}/specimens`, {
      headers,
      data: { label, condition, stage: "HH31" },
    });
    expect(specimen.status()).toBe(201);
    const upload = await page.request.post(`/api/v1/labs/${labId}/specimens/${(await specimen.json()).id}/uploads`, {
      headers,
      multipart: { file: { name: `${label}-spacings.csv`, mimeType: "text/csv", buffer: spacingTable(spacingUm) } },
    });
    expect(upload.status()).toBe(201);
  }
  // Each table's readout is a job; the comparison counts only finished readouts.
  await expect
    .poll(
      async () => {
        const res = await page.request.get(`/api/v1/labs/${labId}/studies/${studyId}/comparison`);
        const body = (await res.json()) as { groups?: { nSpecimens: number }[] };
        return (body.groups ?? []).reduce((sum, g) => sum + g.nSpecimens, 0);
      },
      { timeout: 60_000 },
    )
    .toBe(4);
  return { name, studyId };
}

test("a 95 % CI far wider than the data stays inside the axes, its cut ends marked with their values", async ({
  lab,
  page,
}) => {
  const { studyId } = await seedStudy(page, lab.labId);
  await page.goto(`/labs/${lab.labId}/studies/${studyId}`);
  const study = lab.on(StudyPage);
  await expect(study.comparisonRows).toHaveCount(2);
  await expect(study.comparisonRow("uneven")).toContainText("-28.53 – 98.53 µm");

  const chart = study.comparison.locator("svg").filter({ has: page.getByTestId("condition-dots-group") });
  await expect(chart).toBeVisible();
  const uneven = chart.getByTestId("condition-dots-group").filter({ hasText: "uneven" });
  const marks = uneven.getByTestId("ci-beyond");
  await expect(marks).toHaveCount(2);
  await expect(marks.nth(0)).toContainText("↓ -28.53 µm");
  await expect(marks.nth(1)).toContainText("↑ 98.53 µm");
  // The "even" whisker (35.5 ± 6.35 µm) fits the axis: capped, not cut.
  await expect(
    chart
      .getByTestId("condition-dots-group")
      .filter({ hasText: "even" })
      .filter({ hasNotText: "uneven" })
      .getByTestId("ci-beyond"),
  ).toHaveCount(0);

  // Every whisker, arrow and value label lies inside the chart. Measured together, in one layout of
  // the page: measured one after the other, the chart and a whisker could be read on either side of
  // a layout change above the chart (the page moved down 40 px between them once), so a whisker
  // inside the chart was reported below it.
  await expect(chart.getByTestId("ci-whisker")).toHaveCount(2);
  const outside = await chart.evaluate((svg) => {
    const box = svg.getBoundingClientRect();
    return [...svg.querySelectorAll('[data-testid="ci-whisker"]')].flatMap((whisker, i) => {
      const w = whisker.getBoundingClientRect();
      return [
        w.top < box.top ? `whisker ${i + 1}'s top (${w.top}) is above the chart's (${box.top})` : [],
        w.bottom > box.bottom ? `whisker ${i + 1}'s bottom (${w.bottom}) is below the chart's (${box.bottom})` : [],
        w.right > box.right ? `whisker ${i + 1}'s right edge (${w.right}) is past the chart's (${box.right})` : [],
      ].flat();
    });
  });
  expect(outside).toEqual([]);
  await study.comparison.scrollIntoViewIfNeeded();
  await page.screenshot({ path: "test-results/whiskers-clipped.png", fullPage: true });
});
