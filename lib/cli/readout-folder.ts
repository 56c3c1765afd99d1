/**
 * `readout FOLDER`: every image and table in one folder (not its subfolders; hidden files
 * skipped), each read by the single-file readout, one CSV row per file. A file that cannot be
 * read gets its row with status "failed" and the reason; the others go on.
 */
import { readdirSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { CliError } from "./command";

export const FOLDER_CSV_COLUMNS = [
  "file",
  "wavelength_um",
  "uncertainty_um",
  "symmetry",
  "significance",
  "status",
  "message",
] as const;

/** Exit code when the folder was read but some files failed (2 and 3 are whole-command errors). */
export const SOME_FILES_FAILED_EXIT = 4;

export interface FolderRow {
  file: string;
  wavelengthUm: number | null;
  uncertaintyUm: number | null;
  symmetry: string | null;
  significance: number | null;
  status: "read" | "no significant period" | "failed";
  message: string;
}

type ReadOne = (args: string[]) => Promise<{ json: unknown }>;
type Summary = { mean: number; sem: number };
type OneJson = {
  fileKind?: string;
  periodFound?: boolean;
  wavelengthUm?: number | null;
  uncertaintyUm?: number | null;
  symmetry?: string | null;
  significance?: number;
  significanceThreshold?: number;
  warnings?: string[];
  kind?: string;
  meanSpacingUm?: number;
  equivalentHexWavelengthUm?: number;
  nearestNeighbourUm?: Summary | number | null;
  spacingUm?: Summary;
};

export function isFolder(p: string): boolean {
  try {
    return statSync(p).isDirectory();
  } catch {
    return false;
  }
}

/**
 * A table's number comparable with a Fourier wavelength (SCIENCE.md §4, as the server's headline):
 * mean spacing for positions and spacing lists, (√3/2)·mean nearest-neighbour distance for centroids.
 */
function tableRow(j: OneJson): Pick<FolderRow, "wavelengthUm" | "uncertaintyUm"> {
  if (j.kind === "centroids-2d" && typeof j.nearestNeighbourUm === "object" && j.nearestNeighbourUm)
    return {
      wavelengthUm: j.equivalentHexWavelengthUm ?? null,
      uncertaintyUm: (Math.sqrt(3) / 2) * j.nearestNeighbourUm.sem,
    };
  if (j.kind === "positions-1d")
    return { wavelengthUm: j.meanSpacingUm ?? null, uncertaintyUm: j.spacingUm?.sem ?? null };
  return { wavelengthUm: j.spacingUm?.mean ?? null, uncertaintyUm: j.spacingUm?.sem ?? null };
}

function rowOf(file: string, j: OneJson): FolderRow {
  const warnings = (j.warnings ?? []).join("; ");
  if (j.fileKind === "csv" || j.fileKind === "tsv")
    return { file, ...tableRow(j), symmetry: null, significance: null, status: "read", message: warnings };
  if (!j.periodFound)
    return {
      file,
      wavelengthUm: null,
      uncertaintyUm: null,
      symmetry: null,
      significance: j.significance ?? null,
      status: "no significant period",
      message:
        `no significant period (significance ${j.significance?.toPrecision(3)} < ${j.significanceThreshold})` +
        (warnings ? `; ${warnings}` : ""),
    };
  return {
    file,
    wavelengthUm: j.wavelengthUm ?? null,
    uncertaintyUm: j.uncertaintyUm ?? null,
    symmetry: j.symmetry ?? null,
    significance: j.significance ?? null,
    status: "read",
    message: warnings,
  };
}

/**
 * One CSV cell. As the server's CSV writer: a text cell that a spreadsheet would run as a formula
 * (starts with = + - @, tab or CR) gets a leading ', numbers stay numbers (OWASP "CSV Injection").
 */
function cell(v: string | number | null): string {
  if (v === null) return "";
  let s = String(v);
  if (typeof v === "string" && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function folderRowsToCsv(rows: FolderRow[]): string {
  const lines = [FOLDER_CSV_COLUMNS.join(",")];
  for (const r of rows)
    lines.push(
      [r.file, r.wavelengthUm, r.uncertaintyUm, r.symmetry, r.significance, r.status, r.message].map(cell).join(","),
    );
  return lines.join("\n") + "\n";
}

/** `args`: the command's words; the folder is replaced by each file, `--csv` is taken out. */
export async function readFolder(folder: string, args: string[], csvPath: string | undefined, readOne: ReadOne) {
  let names: string[];
  try {
    names = readdirSync(folder)
      .filter((n) => !n.startsWith("."))
      .filter((n) => statSync(path.join(folder, n)).isFile())
      .sort((a, b) => a.localeCompare(b));
  } catch (e) {
    throw new CliError(`Cannot read the folder ${folder}: ${(e as Error).message}`);
  }
  if (names.length === 0) throw new CliError(`The folder ${folder} holds no files to read.`);
  const rest: string[] = [];
  for (let i = 0; i < args.length; i++) {
    if (args[i] === folder) continue;
    if (args[i] === "--csv") i++;
    else if (!args[i].startsWith("--csv=")) rest.push(args[i]);
  }
  const rows: FolderRow[] = [];
  for (const name of names) {
    try {
      const { json } = await readOne([path.join(folder, name), ...rest]);
      rows.push(rowOf(name, json as OneJson));
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      rows.push({
        file: name,
        wavelengthUm: null,
        uncertaintyUm: null,
        symmetry: null,
        significance: null,
        status: "failed",
        message,
      });
    }
  }
  const csv = folderRowsToCsv(rows);
  if (csvPath) {
    try {
      writeFileSync(csvPath, csv);
    } catch (e) {
      throw new CliError(`Cannot write ${csvPath}: ${(e as Error).message}`);
    }
  }
  const failed = rows.filter((r) => r.status === "failed").length;
  const note = `${rows.length} file(s) read: ${rows.length - failed} read, ${failed} failed${csvPath ? `; CSV written to ${csvPath}` : ""}`;
  return {
    json: { folder, csv: csvPath ?? null, files: rows.length, failed, rows },
    text: csvPath ? note : `${csv.trimEnd()}\n# ${note}`,
    ...(failed > 0 ? { exitCode: SOME_FILES_FAILED_EXIT } : {}),
  };
}
