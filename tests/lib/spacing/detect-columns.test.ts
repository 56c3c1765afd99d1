/**
 * Columns detected from a table's header: which roles, which unit, and a refusal that lists every
 * column by letter and header when the guess is ambiguous. Expected columns are read off each
 * header by hand (common practice, no source); ImageJ's Results table names centroid columns X, Y
 * and centre-of-mass columns XM, YM (ImageJ user guide, "Set Measurements", from memory).
 */
import { describe, expect, it } from "vitest";
import { detectColumns, readDelimitedText, readSpacingFromGrid, unitOfHeader } from "@/lib/spacing";

const read = (text: string, settings = {}) => readSpacingFromGrid(readDelimitedText(text), settings);

describe("column detection from the header", () => {
  it.each([
    [["X (µm)", "Y (µm)"], { x: "X (µm)", y: "Y (µm)" }, "um"],
    [["id", "cx [px]", "cy [px]"], { x: "cx [px]", y: "cy [px]" }, "px"],
    [["Centroid_X_nm", "Centroid_Y_nm"], { x: "Centroid_X_nm", y: "Centroid_Y_nm" }, "nm"],
    [["label", "spacing (µm)"], { spacing: "spacing (µm)" }, "um"],
    [["Abstand_um"], { spacing: "Abstand_um" }, "um"],
    [["Abstände (µm)", "Notiz"], { spacing: "Abstände (µm)" }, "um"],
    [["écart (nm)"], { spacing: "écart (nm)" }, "nm"],
    [["NN distance (μm)"], { spacing: "NN distance (μm)" }, "um"], // Greek mu, as some keyboards type it
    [["position in mm", "intensity"], { position: "position in mm" }, "mm"],
    [["Posición (micrometres)"], { position: "Posición (micrometres)" }, "um"],
    [["x_um", "intensity"], { position: "x_um" }, "um"], // a lone x: positions along a line
    [["spacing", "x"], { spacing: "spacing" }, null], // a lone x beside a spacing column is not read
    [["Distance/px"], { position: "Distance/px" }, "px"],
  ])("%j → %j, unit %s", (header, columns, unit) => {
    const d = detectColumns(header);
    expect(d.columns).toEqual(columns);
    expect(d.unit).toBe(unit);
  });

  it("a header word that only ends like a unit is not one", () => {
    expect(unitOfHeader("sum")).toBeNull();
    expect(unitOfHeader("spacing")).toBeNull();
    expect(unitOfHeader("spacing (pixels)")).toBe("px");
  });

  it.each([
    [
      ["", "Area", "X", "Y", "XM", "YM"],
      'The header has 2 columns that could be x: C ("X"), E ("XM"). Choose the columns in the form (x and y, or position, or spacing); the columns are: A (no header), B ("Area"), C ("X"), D ("Y"), E ("XM"), F ("YM").',
    ],
    [
      ["spacing (µm)", "spacing (px)"],
      'The header has 2 columns that could be the spacing: A ("spacing (µm)"), B ("spacing (px)"). Choose the columns in the form (x and y, or position, or spacing); the columns are: A ("spacing (µm)"), B ("spacing (px)").',
    ],
    [
      ["position", "distance"],
      'The header has 2 columns that could be the position: A ("position"), B ("distance"). Choose the columns in the form (x and y, or position, or spacing); the columns are: A ("position"), B ("distance").',
    ],
    [
      ["x (px)", "y (µm)"],
      'The headers of the columns taken state different units (px, um). Choose the columns in the form (x and y, or position, or spacing); the columns are: A ("x (px)"), B ("y (µm)").',
    ],
    [
      ["area", "perimeter"],
      'Could not tell from the header which columns to read. Choose the columns in the form (x and y, or position, or spacing); the columns are: A ("area"), B ("perimeter").',
    ],
  ])("%j is refused with the columns listed", (header, message) => {
    expect(() => detectColumns(header)).toThrow(message);
  });

  it("says which columns were taken, with their letters, and reads them", () => {
    // 2 × 2 points 10 µm apart: every nearest-neighbour distance is 10 µm (geometry, by hand).
    const r = read("id,X (µm),Y (µm)\n1,0,0\n2,10,0\n3,0,10\n4,10,10\n");
    expect(r.columnsTaken).toBe('x = B ("X (µm)"), y = C ("Y (µm)")');
    expect(r.mapping).toEqual({ x: "X (µm)", y: "Y (µm)", unit: "um", guessed: true });
    expect(r.table.kind === "centroids-2d" && r.table.nearestNeighbourUm.mean).toBe(10);
  });

  it("the unit comes from the header unless the settings give one", () => {
    // spacings 3 and 5 nm → mean 4 nm = 0.004 µm (by hand)
    expect(read("spacing (nm)\n3\n5\n").table).toMatchObject({ kind: "spacings", spacingUm: { mean: 0.004 } });
    expect(read("spacing (nm)\n3\n5\n", { unit: "um" }).table).toMatchObject({ spacingUm: { mean: 4 } });
  });

  it("a column chosen in the form may be named by its letter, which also settles an ambiguous header", () => {
    // X = 0, 10, 20 → spacings 10, 10 (by hand); XM ignored
    const r = read("X,XM\n0,1\n10,4\n20,9\n", { columns: { position: "A" } });
    expect(r.columnsTaken).toBe('position = A ("X")');
    expect(r.table).toMatchObject({ kind: "positions-1d", meanSpacingUm: 10 });
    expect(() => read("x,x\n1,2\n3,4\n5,6\n", { columns: { position: "x" } })).toThrow(
      '2 columns are named "x": A ("x"), B ("x"); give the column letter for position instead.',
    );
  });

  it("no header: the first line holds numbers", () => {
    expect(() => read("12;13\n14;15\n")).toThrow(
      'Line 1 must be a header naming the columns, but it holds only numbers (columns A, B): add a header line naming them, e.g. "spacing (µm)".',
    );
  });
});
