/**
 * XLSX workbooks (written here with exceljs): the first sheet or a named one, formulas by their
 * saved values, dates and error values refused in a numeric column, and the file kind judged from
 * the ZIP's parts. Expected means are computed by hand beside each check.
 */
import { describe, expect, it } from "vitest";
import { sniffFileKind } from "@/lib/imaging";
import { readSpacingFromGrid, readTableGrid, zipEntries } from "@/lib/spacing";
import { writeWorkbook } from "../../support/xlsx-fixtures";

const read = async (bytes: Uint8Array, settings: { sheet?: string; columns?: Record<string, string> } = {}) =>
  readSpacingFromGrid(await readTableGrid(bytes, settings.sheet), settings);

describe("XLSX workbooks", () => {
  it("reads the first sheet, detects the columns and says so", async () => {
    // 2 × 2 points 4 µm apart: every nearest-neighbour distance is 4 µm (geometry, by hand)
    const bytes = await writeWorkbook({
      Spots: [
        ["Spot", "X (µm)", "Y (µm)"],
        ["a", 0, 0],
        ["b", 4, 0],
        ["c", 0, 4],
        ["d", 4, 4],
      ],
      Other: [["spacing"], [100], [200]],
    });
    const r = await read(bytes);
    expect(r.source).toEqual({ kind: "xlsx", sheet: "Spots" });
    expect(r.columnsTaken).toBe('x = B ("X (µm)"), y = C ("Y (µm)")');
    expect(r.table).toMatchObject({ kind: "centroids-2d", n: 4, nearestNeighbourUm: { mean: 4 } });
  });

  it("reads the sheet named in the settings, and lists the sheets when it is not there", async () => {
    const bytes = await writeWorkbook({ First: [["note"], ["x"]], Spacings: [["spacing (nm)"], [100], [300]] });
    // 100 and 300 nm → mean 200 nm = 0.2 µm (by hand)
    expect((await read(bytes, { sheet: "Spacings" })).table).toMatchObject({ spacingUm: { mean: 0.2 } });
    await expect(read(bytes, { sheet: "Sheet9" })).rejects.toThrow(
      'The workbook has no sheet named "Sheet9"; its sheets are: "First", "Spacings".',
    );
  });

  it("reads formulas by their saved values and refuses one saved without", async () => {
    // A2 = 10, A3 = A2*2 saved as 20, A4 = 30 → spacings 10, 20, 30, mean 20 (by hand)
    const ok = await writeWorkbook({
      S: [["spacing"], [10], [{ formula: "A2*2", result: 20 }], [30]],
    });
    expect((await read(ok)).table).toMatchObject({ spacingUm: { mean: 20 } });
    const unsaved = await writeWorkbook({ S: [["spacing"], [10], [{ formula: "A2*2" }]] });
    await expect(read(unsaved)).rejects.toThrow(
      'Line 3, column A ("spacing"): the formula "=A2*2" has no saved value (the file was written by a program that does not compute formulas); open and save it in a spreadsheet program.',
    );
  });

  it("refuses a date and an error value in a numeric column, naming line and column", async () => {
    const dated = await writeWorkbook({
      S: [
        ["id", "spacing (µm)"],
        [1, 12],
        [2, new Date(Date.UTC(2024, 2, 1))],
      ],
    });
    await expect(read(dated)).rejects.toThrow(
      'Line 3, column B ("spacing (µm)"): the cell holds a date (2024-03-01), not a number; format the column as numbers.',
    );
    const broken = await writeWorkbook({ S: [["spacing"], [12], [{ error: "#DIV/0!" }]] });
    await expect(read(broken)).rejects.toThrow('Line 3, column A ("spacing"): the cell holds the error #DIV/0!.');
  });

  it("counts lines as the sheet numbers its rows (blank rows included)", async () => {
    const bytes = await writeWorkbook({ S: [["spacing"], [12], [], ["12..5"]] });
    await expect(read(bytes)).rejects.toThrow('Line 4, column A ("spacing"): "12..5" is not a number.');
  });

  it("is sniffed from its content: the ZIP holds [Content_Types].xml and parts under xl/", async () => {
    const bytes = await writeWorkbook({ S: [["spacing"], [1], [2]] });
    expect(sniffFileKind(bytes)).toBe("xlsx");
    const names = zipEntries(bytes).map((e) => e.name);
    expect(names).toContain("[Content_Types].xml");
    expect(names).toContain("xl/workbook.xml");
  });

  it("a ZIP that is not a workbook is neither sniffed as one nor read", async () => {
    // A stored ZIP with one file "a.txt" holding "hi" (PKWARE APPNOTE §4.3.7 and §4.3.12, by hand).
    const name = Buffer.from("a.txt");
    const data = Buffer.from("hi");
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt32LE(2, 18);
    local.writeUInt32LE(2, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt32LE(2, 20);
    central.writeUInt32LE(2, 24);
    central.writeUInt16LE(name.length, 28);
    const end = Buffer.alloc(22);
    end.writeUInt32LE(0x06054b50, 0);
    end.writeUInt16LE(1, 8);
    end.writeUInt16LE(1, 10);
    end.writeUInt32LE(46 + name.length, 12);
    end.writeUInt32LE(30 + name.length + data.length, 16);
    const zip = new Uint8Array(Buffer.concat([local, name, data, central, name, end]));
    expect(zipEntries(zip)).toEqual([{ name: "a.txt", uncompressedBytes: 2 }]);
    expect(sniffFileKind(zip)).toBeNull();
    await expect(readTableGrid(zip)).rejects.toThrow("The file is a ZIP archive but not an XLSX workbook.");
  });

  it("a sheet setting on a text table is refused", async () => {
    await expect(readTableGrid(new TextEncoder().encode("spacing\n1\n2\n"), "Sheet1")).rejects.toThrow(
      "sheet: only a workbook has sheets; this file is a text table (CSV/TSV).",
    );
  });
});
