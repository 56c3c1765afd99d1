import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import type { TableReadoutResult } from "@/lib/server/readouts/result";
import { TableResult } from "@/app/(lab)/labs/[labId]/readouts/[readoutId]/table-result";

// The table result says in words which columns were taken (letter and header), from which sheet,
// and with which decimal mark (common practice, no source: the user must be able to check the guess).
const summary = { n: 3, mean: 2.25, sd: 0.75, sem: 0.433, cv: 0.333, median: 2.25, min: 1.5, max: 3, ci95: [0.4, 4.1] };
const result = (extra: Partial<TableReadoutResult>): TableReadoutResult => ({
  type: "table",
  mapping: { spacing: "Abstand (µm)", unit: "um", guessed: true },
  pixelSizeUm: null,
  pixelSizeSource: null,
  table: { kind: "spacings", n: 3, spacingUm: summary as never, warnings: [] },
  ...extra,
});
const text = (html: string) =>
  html
    .replace(/<[^>]+>/g, "")
    .replace(/&quot;/g, '"')
    .replace(/&#x27;/g, "'");

describe("TableResult", () => {
  it("names the columns taken with their letters, the sheet and the decimal mark", () => {
    const html = renderToStaticMarkup(
      createElement(TableResult, {
        result: result({
          columnsTaken: 'spacing = A ("Abstand (µm)")',
          source: { kind: "xlsx", sheet: "Messung 1" },
          decimalMark: ",",
        }),
      }),
    );
    expect(text(html)).toContain(
      'Read as a list of spacings from the sheet “Messung 1”. Columns taken from the header: spacing = A ("Abstand (µm)"); unit µm; numbers written with decimal commas',
    );
  });

  it("a readout made before the letters were recorded still names its columns", () => {
    const html = renderToStaticMarkup(createElement(TableResult, { result: result({}) }));
    expect(text(html)).toContain("Columns taken from the header: spacing = “Abstand (µm)”; unit µm");
  });
});
