/**
 * A malformed table is refused with the line as a spreadsheet counts it (header = line 1, blank
 * lines counted) and the column by letter and header. Line numbers are counted by hand in each
 * text (common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { readDelimitedText, readSpacingFromGrid } from "@/lib/spacing";

const read = (text: string, settings = {}) => readSpacingFromGrid(readDelimitedText(text), settings);
const rows = (n: number, make: (i: number) => string) => Array.from({ length: n }, (_, i) => make(i));

describe("malformed lines", () => {
  it("names line 14 and column C of a 14-line file", () => {
    const text = ["id,label,spacing (µm)", ...rows(12, (i) => `${i},s${i},${10 + i}`), "13,s13,12..5"].join("\n");
    expect(() => read(text)).toThrow('Line 14, column C ("spacing (µm)"): "12..5" is not a number.');
  });

  it("counts blank lines as a spreadsheet does", () => {
    // header (1), 10 (2), blank (3), blank (4), abc (5)
    expect(() => read("spacing\n10\n\n\nabc\n")).toThrow('Line 5, column A ("spacing"): "abc" is not a number.');
  });

  it("counts a quoted cell spanning two lines as one row", () => {
    // header (1), 10 with a two-line note (2), 11 (3), an empty spacing cell (4)
    expect(() => read('spacing;note\n10;"two\nlines"\n11;b\n;c\n')).toThrow(
      'Line 4, column A ("spacing"): the cell is empty.',
    );
  });

  it("a cell missing at the end of a short row is empty", () => {
    expect(() => read("x;y\n1;2\n3\n")).toThrow('Line 3, column B ("y"): the cell is empty.');
  });

  it("a column without a header is named by its letter", () => {
    expect(() => read("spacing,\n1,2\nx,3\n", { columns: { spacing: "B" } })).not.toThrow();
    expect(() => read("spacing,\n1,2\n2,z\n", { columns: { spacing: "B" } })).toThrow(
      'Line 3, column B (no header): "z" is not a number.',
    );
  });

  it("an empty file and a file of blank lines", () => {
    expect(() => read("")).toThrow("The file is empty.");
    expect(() => read("\n \n\t\n")).toThrow("The file is empty.");
  });
});
