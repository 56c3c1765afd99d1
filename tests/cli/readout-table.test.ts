/**
 * `cli readout` on the table files labs have: an XLSX workbook and a semicolon file with decimal
 * commas, columns taken from the header and named in the output. Expected means by hand.
 */
import { execFile } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { writeWorkbook } from "../support/xlsx-fixtures";

const run = promisify(execFile);
const ROOT = path.resolve(import.meta.dirname, "../..");
const cli = (args: string[]) =>
  run(process.execPath, ["--import", "tsx", path.join(ROOT, "lib/cli/main.ts"), ...args], {
    cwd: ROOT,
    timeout: 60_000,
  });

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), "morphokin-cli-table-"));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("cli readout of tables", () => {
  it("reads the named sheet of an XLSX workbook", async () => {
    // spacings 2 and 4 nm on sheet "B" → mean 3 nm = 0.003 µm (by hand)
    const file = path.join(dir, "spacings.xlsx");
    writeFileSync(file, await writeWorkbook({ A: [["note"], ["-"]], B: [["spacing (nm)"], [2], [4]] }));
    const { stdout } = await cli(["readout", file, "--sheet", "B", "--json"]);
    const out = JSON.parse(stdout) as { fileKind: string; columnsTaken: string; spacingUm: { mean: number } };
    expect(out.fileKind).toBe("xlsx");
    expect(out.columnsTaken).toBe('spacing = A ("spacing (nm)")');
    expect(out.spacingUm.mean).toBeCloseTo(0.003, 12);
  });

  it("reads a semicolon file with decimal commas, a column given by its letter", async () => {
    // column B: positions 0.5, 2, 3.5 → mean spacing 1.5 µm (by hand)
    const file = path.join(dir, "positions.csv");
    writeFileSync(file, "id;Lage (µm)\n1;0,5\n2;2\n3;3,5\n");
    const { stdout } = await cli(["readout", file, "--position", "B", "--json"]);
    expect(JSON.parse(stdout)).toMatchObject({ fileKind: "csv", kind: "positions-1d", meanSpacingUm: 1.5 });
  });
});
