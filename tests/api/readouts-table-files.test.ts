/**
 * The table files labs have, through the API: an XLSX workbook and a semicolon-separated file
 * with decimal commas are uploaded, shown as tables and read; an ambiguous header is refused
 * naming its columns and then read with the columns chosen. Expected values by hand, beside each.
 */
import { describe, expect, it } from "vitest";
import { readTable } from "@/lib/server/readouts/process";
import type { ReadoutDto } from "@/lib/server/readouts/readouts";
import { setupReadoutLab } from "../support/readouts";
import { writeWorkbook } from "../support/xlsx-fixtures";

const { api, newSpecimen, uploadFile, finished } = setupReadoutLab();

describe("table files: XLSX and semicolon CSV", () => {
  it("an XLSX workbook is uploaded as a table and read from its first sheet", async () => {
    // Positions 0, 10, 21, 30, 41 µm → spacings 10, 11, 9, 11, mean 10.25 µm (by hand)
    const bytes = await writeWorkbook({
      Positions: [
        ["Position (µm)", "Note"],
        [0, "a"],
        [10, "b"],
        [21, "c"],
        [30, "d"],
        [41, "e"],
      ],
    });
    const up = await uploadFile((await newSpecimen()).id, "stripes.bin", bytes);
    expect(up.status).toBe(201);
    const r = await finished(up.body.readout);
    expect(r.status).toBe("succeeded");
    if (r.result?.type !== "table") throw new Error("expected a table readout");
    expect(r.result.columnsTaken).toBe('position = A ("Position (µm)")');
    expect(r.result.source).toEqual({ kind: "xlsx", sheet: "Positions" });
    expect(r.result.mapping).toMatchObject({ position: "Position (µm)", unit: "um", guessed: true });
    expect(r.headline).toMatchObject({ measure: "mean-spacing-1d", wavelengthUm: 10.25 });
  });

  it("a semicolon file with decimal commas is read with its decimal mark", async () => {
    // Spacings 1.5, 2.25, 3 µm → mean 2.25 µm (by hand)
    const csv = "Abstand (µm);Notiz\r\n1,5;a\r\n2,25;b\r\n3;c\r\n";
    const up = await uploadFile((await newSpecimen()).id, "abstand.csv", new TextEncoder().encode(csv));
    expect(up.status).toBe(201);
    const r = await finished(up.body.readout);
    if (r.result?.type !== "table") throw new Error("expected a table readout");
    expect(r.result.decimalMark).toBe(",");
    expect(r.result.columnsTaken).toBe('spacing = A ("Abstand (µm)")');
    expect(r.headline).toMatchObject({ measure: "mean-spacing-table", wavelengthUm: 2.25 });
  });

  it("an ambiguous header is refused naming its columns; the upload is kept and read with the columns chosen", async () => {
    const bytes = await writeWorkbook({
      Results: [
        ["", "X", "Y", "XM", "YM"],
        [1, 0, 0, 0.1, 0.1],
        [2, 6, 0, 6.1, 0.1],
        [3, 0, 6, 0.1, 6.1],
      ],
    });
    const up = await uploadFile((await newSpecimen()).id, "Results.xlsx", bytes);
    const r = await finished(up.body.readout);
    expect(r.status).toBe("failed");
    expect(r.error).toBe(
      'The header has 2 columns that could be x: B ("X"), D ("XM"). Choose the columns in the form (x and y, or position, or spacing); the columns are: A (no header), B ("X"), C ("Y"), D ("XM"), E ("YM").',
    );
    const res = await api(
      "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts",
      { uploadId: up.body.id },
      { json: { columns: { x: "X", y: "Y" }, sheet: "Results" } },
    );
    expect(res.status).toBe(202); // accepted: the readout runs as a job
    const again = await finished((await res.json()) as ReadoutDto);
    if (again.result?.type !== "table" || again.result.table.kind !== "centroids-2d")
      throw new Error("expected a centroids readout");
    // (0,0), (6,0), (0,6): nearest neighbours 6, 6, 6 µm (by hand)
    expect(again.result.table.nearestNeighbourUm.mean).toBe(6);
    expect(again.result.columnsTaken).toBe('x = B ("X"), y = C ("Y")');
  });

  it("a malformed semicolon file fails naming the line and the column", async () => {
    const csv = "id;spacing (µm)\n1;12,5\n2;12..5\n";
    const up = await uploadFile((await newSpecimen()).id, "bad.csv", new TextEncoder().encode(csv));
    const r = await finished(up.body.readout);
    expect(r.status).toBe("failed");
    expect(r.error).toBe('Line 3, column B ("spacing (µm)"): "12..5" is not a number.');
  });

  it("an XLSX workbook is read in the readout's child process too", async () => {
    // Spacings 2 and 4 mm → mean 3 mm = 3000 µm (by hand)
    const bytes = await writeWorkbook({ S: [["spacing (mm)"], [2], [4]] });
    const settings = { kind: "table" as const, pixelSizeUm: null, pixelSizeSource: null };
    const r = await readTable(bytes, settings, new AbortController().signal);
    expect(r.table).toMatchObject({ kind: "spacings", spacingUm: { mean: 3000 } });
    expect(r.columnsTaken).toBe('spacing = A ("spacing (mm)")');
  });
});
