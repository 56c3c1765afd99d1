import { describe, expect, it } from "vitest";
import { readSpacingTable, welchTTest } from "@/lib/spacing";

describe("table errors (exact messages naming the line as a spreadsheet counts it, and the column by letter and header)", () => {
  it.each([
    ["", { spacing: "s" }, "The file is empty."],
    [
      "1,2\n3,4\n",
      { x: "x", y: "y" },
      'Line 1 must be a header naming the columns, but it holds only numbers (columns A, B): add a header line naming them, e.g. "spacing (µm)".',
    ],
    ["x,y\n1,2\n3,abc\n", { x: "x", y: "y" }, 'Line 3, column B ("y"): "abc" is not a number.'],
    ["x,y\n1,2\n,4\n", { x: "x", y: "y" }, 'Line 3, column A ("x"): the cell is empty.'],
    ["a,b\n1,2\n", { x: "x", y: "b" }, 'Column "x" (x) is not in the header; the columns are: A ("a"), B ("b").'],
    ["x,y\n1,2\n", { x: "x", y: "y" }, "At least 2 points are needed for nearest-neighbour distances (got 1)."],
    ["p\n1\n2\n", { position: "p" }, "At least 3 positions are needed for a spacing summary (got 2)."],
    ["x,y\n1,2\n", { x: "x" }, "2-D centroids need both an x and a y column."],
    ["x,y\n1,2\n", { x: "x", y: "y", unit: "px" }, 'unit "px" needs pixelSizeUm (µm/px) above 0.'],
  ] as const)("%#", (text, mapping, message) => {
    expect(() => readSpacingTable(text, mapping)).toThrow(message);
  });
  it("Welch needs two values per group", () => {
    expect(() => welchTTest([1], [2, 3])).toThrow("Each group needs at least 2 values (got 1 and 2).");
  });
});
