/**
 * Semicolon- and tab-separated files with decimal commas, as spreadsheet programs save "CSV" in
 * locales whose decimal mark is a comma (common practice, no source). Thousands separators are
 * never guessed. Every expected mean is computed by hand in the comment beside it.
 */
import { describe, expect, it } from "vitest";
import { decodeTableText, readDelimitedText, readSpacingFromGrid, readTableGrid } from "@/lib/spacing";
import { sniffFileKind } from "@/lib/imaging";

const read = (text: string, settings = {}) => readSpacingFromGrid(readDelimitedText(text), settings);

describe("decimal commas", () => {
  it("a semicolon file with decimal commas", () => {
    // spacings 1.5, 2.25, 3 → mean 6.75/3 = 2.25 (by hand)
    const r = read("Abstand (µm);Notiz\r\n1,5;a\r\n2,25;b\r\n3;c\r\n");
    expect(r.decimalMark).toBe(",");
    expect(r.source).toEqual({ kind: "text", delimiter: ";" });
    expect(r.table).toMatchObject({ kind: "spacings", n: 3, spacingUm: { mean: 2.25 } });
  });

  it("2-D centroids in a semicolon file: 1,5;2,25 is two numbers, not four", () => {
    // (1.5, 2.25), (11.5, 2.25), (1.5, 12.25): nearest neighbours 10, 10, 10 (by hand)
    const r = read("x (µm);y (µm)\n1,5;2,25\n11,5;2,25\n1,5;12,25\n");
    expect(r.table).toMatchObject({ kind: "centroids-2d", n: 3, nearestNeighbourUm: { mean: 10 } });
  });

  it("a tab-separated file and a one-column file with decimal commas", () => {
    // positions 0.5, 2, 3.5 → mean spacing 1.5 (by hand)
    expect(read("position\tnote\n0,5\tp\n2\tq\n3,5\tr\n").table).toMatchObject({ meanSpacingUm: 1.5 });
    // spacings 12.5 and 13 → mean 12.75 (by hand)
    expect(read("spacing (µm)\n12,5\n13\n").table).toMatchObject({ spacingUm: { mean: 12.75 } });
  });

  it("a comma-separated file keeps decimal points, and a semicolon file without commas too", () => {
    expect(read("spacing,label\n1.5,a\n2.5,b\n").table).toMatchObject({ spacingUm: { mean: 2 } });
    expect(read("spacing;label\n1.5;a\n2.5;b\n").decimalMark).toBe(".");
  });

  it.each([
    [
      "id;spacing (µm)\n1;1.234,5\n2;3,5\n",
      'Line 2, column B ("spacing (µm)"): "1.234,5" looks like a number with a thousands separator; thousands separators are not guessed: remove them and keep one decimal mark.',
    ],
    [
      "spacing (µm);id\n2,5;1\n1.5;2\n",
      'Line 3, column A ("spacing (µm)"): "1.5" has a point, but the numbers of this file use decimal commas; a point could be a decimal point or a thousands separator, so it is not guessed: write it with a decimal comma.',
    ],
    [
      "spacing,id\n1,234.5,1\n2,3\n",
      "Line 2 has 3 cells, but the header names 2 columns: a comma inside a number or a text without quotes? (the line reads: 1,234.5,1)",
    ],
    [
      'spacing,id\n"12,5",1\n"13,5",2\n',
      'Line 2, column A ("spacing"): "12,5" has a decimal comma where decimal points are expected: save a comma-separated file with ";" as the separator, or format a workbook cell as a number.',
    ],
    [
      "spacing;id\n1 234;1\n5;2\n",
      'Line 2, column A ("spacing"): "1 234" looks like a number with a thousands separator; thousands separators are not guessed: remove them and keep one decimal mark.',
    ],
  ])("%#: refused, not guessed", (text, message) => {
    expect(() => read(text)).toThrow(message);
  });

  it("a Windows-1252 file (µ as byte 0xB5) is read and sniffed as a table", async () => {
    // "Abstand (µm);n\n1,5;1\n2,5;2\n" in Windows-1252: spacings 1.5, 2.5 → mean 2 (by hand)
    const bytes = Uint8Array.from([..."Abstand (\u00b5m);n\n1,5;1\n2,5;2\n"].map((c) => c.charCodeAt(0)));
    expect(() => new TextDecoder("utf-8", { fatal: true }).decode(bytes)).toThrow();
    expect(decodeTableText(bytes).startsWith("Abstand (µm)")).toBe(true);
    expect(sniffFileKind(bytes)).toBe("csv");
    const r = readSpacingFromGrid(await readTableGrid(bytes), {});
    expect(r.table).toMatchObject({ spacingUm: { mean: 2 } });
  });

  it("a one-column list with decimal commas is sniffed as a table", () => {
    expect(sniffFileKind(new TextEncoder().encode("Abstand (µm)\n12,5\n13,25\n"))).toBe("csv");
  });
});
