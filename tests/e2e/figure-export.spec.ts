/**
 * An exported figure reads without the page: the SVG a bench scientist downloads from a fit's
 * "Predicted and measured wavelength" panel carries its legend, its axis labels with units and a
 * caption line with the fit's id (the provenance a reader can look up).
 */
import { expect, test } from "./pages/fixtures";
import { FitPage } from "./pages/fit-page";

test.use({ role: "scientist" });

/** The text of every <text> element of an SVG file, tspans joined (common practice, no source). */
function textsOf(svg: string): string[] {
  return [...svg.matchAll(/<text\b[^>]*>([\s\S]*?)<\/text>/g)].map((m) =>
    m[1]
      .replace(/<[^>]+>/g, "")
      .replace(/&amp;/g, "&")
      .replace(/&lt;/g, "<")
      .replace(/&gt;/g, ">")
      .trim(),
  );
}

test("a fit's predicted-and-measured figure exports as SVG with legend, axis units and the fit's id", async ({
  lab,
  page,
}) => {
  const res = await page.request.get(`/api/v1/labs/${lab.labId}/fits?pageSize=1`);
  expect(res.status()).toBe(200);
  const { items } = (await res.json()) as { items: { id: string; name: string }[] };
  expect(items.length, "the demo lab seeds one fit").toBeGreaterThan(0);
  const fitId = items[0].id;

  await page.goto(`/labs/${lab.labId}/fits/${fitId}`);
  const fit = lab.on(FitPage);
  await fit.waitForRanking();
  const figure = fit.figureOf(fit.predictedMeasured);
  await expect(figure.locator(".recharts-legend-item")).toHaveCount(2);

  const { filename, svg } = await fit.exportSvg(figure);
  expect(filename).toMatch(/-predicted-measured\.svg$/);
  const texts = textsOf(svg);
  // The legend entries and axis label as the chart draws them (components/charts/fit-predicted-measured.tsx).
  expect(texts).toContain("measured ± uncertainty");
  expect(texts).toContain("model 2π/k* at the fit");
  expect(texts).toContain("Fourier wavelength λ (µm)");
  expect(texts).toContain("condition");
  // One caption line naming the fit by its id.
  const caption = texts.filter((t) => t.startsWith("Fit "));
  expect(caption).toHaveLength(1);
  expect(caption[0]).toContain(fitId);
  expect(caption[0]).toContain(items[0].name);

  await page.setContent(svg);
  await page.screenshot({ path: "test-results/figure-export-predicted-measured.png" });
});
