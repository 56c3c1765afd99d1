import { formatPlain, formatPlusMinus } from "@/lib/format/measurement";
import { readFileSync } from "node:fs";
import { availableParallelism } from "node:os";
import { setSpectrumExecutor } from "../../fft";
import { startSpectrumThreadsOnDemand } from "../../parallel/spectrum-threads";
import { CliError, parseOptions, type CliCommand } from "../command";
import { toCliError } from "../core-errors";
import {
  decodeImage,
  isImageFile,
  MAX_FULL_RESOLUTION_PIXELS,
  readImageLayout,
  sniffFileKind,
  type ImageFile,
} from "../../imaging";
import { openImageFile, READ_WHOLE_MAX_BYTES } from "../../workers/image-file";
import { DEFAULT_MAX_ANALYSIS_SIDE_PX, readWavelength } from "../../readout";
import { readSpacingFromGrid, readTableGrid, type TableUnit } from "../../spacing";
import { isFolder, readFolder, SOME_FILES_FAILED_EXIT } from "../readout-folder";

/** Bytes of a large file judged for its kind (magic bytes, or a text's first lines). */
const SNIFF_BYTES = 64 * 1024;

const help = `readout FILE [options] [--json]
readout FOLDER [options] [--csv OUT.csv] [--json]

Reads the dominant wavelength of an image (PNG, JPEG, TIFF; 8/16-bit) or summarises a spacing table
(CSV/TSV, also ";"-separated with decimal commas, or an XLSX workbook). The file type is judged from
its content.

A FOLDER reads every file in it (not its subfolders; hidden files skipped) with the same options,
one CSV row per file: file, wavelength_um, uncertainty_um, symmetry, significance, status (read,
no significant period, failed), message. The CSV goes to OUT.csv with --csv, else to the output.
A file that fails gets its row with the reason; the others go on, and the exit code is
${SOME_FILES_FAILED_EXIT} when any file failed.

Image options:
  --pixel-size UM      pixel size in µm/px (default: from the file's metadata; required if absent)
  --channel N|luminance  channel index from 0, or luminance (default luminance)
  --roi x,y,w,h        rectangle in pixels (default: whole image)
  --invert             dark-on-light pattern (negates intensities)
  --threads 1|2        threads of the 2-D FFT and the row passes (default 2 on a machine with 2 or more cores; same numbers)
Table options (give one of, or none to take the columns from the header; COL is a header or a letter):
  --x COL --y COL      2-D centroids: nearest-neighbour statistics, Clark-Evans R
  --position COL       1-D positions: successive spacings
  --spacing COL        a list of spacings
  --unit um|nm|mm|px   unit of the table's numbers (default: as the header says, else um; px needs --pixel-size)
  --sheet NAME         sheet of an XLSX workbook (default: the first)
`;

function num(v: string | true | undefined, name: string): number | undefined {
  if (v === undefined) return undefined;
  const n = Number(v);
  if (v === true || !Number.isFinite(n)) throw new CliError(`--${name} needs a number (got ${String(v)}).`);
  return n;
}

function str(v: string | true | undefined, name: string): string | undefined {
  if (v === true) throw new CliError(`--${name} needs a value.`);
  return v;
}

/** One spectrum thread for the whole command (a FOLDER reads many files with it). */
let spectrumThreads: ReturnType<typeof startSpectrumThreadsOnDemand> | null = null;

function installSpectrumThreads(value: string | true | undefined): void {
  const threads = value === undefined ? (availableParallelism() >= 2 ? 2 : 1) : value === true ? NaN : Number(value);
  if (threads !== 1 && threads !== 2) throw new CliError(`--threads must be 1 or 2 (got ${String(value)}).`);
  // The thread starts with the first transform large enough to be split (small images cost none).
  // With two, the row passes (decode, statistics, residual, blurs) are split too, as in the server's child.
  setSpectrumExecutor(threads === 2 ? (spectrumThreads ??= startSpectrumThreadsOnDemand()) : null);
}

const command: CliCommand = {
  name: "readout",
  summary: "Dominant wavelength of an image, or spacing statistics of a table",
  help,
  async run(args, ctx) {
    const { options, positional } = parseOptions(args, ["invert"]);
    if (positional.length !== 1) throw new CliError("Give exactly one FILE or FOLDER.");
    const path = positional[0];
    if (isFolder(path)) return readFolder(path, args, str(options.csv, "csv"), (a) => command.run(a, ctx));
    let file: ReturnType<typeof openImageFile>;
    let bytes: Buffer | null;
    try {
      file = openImageFile(path);
      // A large file (a slide scan) is read by ranges, never whole; a small one whole, as always.
      bytes = file.size <= READ_WHOLE_MAX_BYTES ? readFileSync(path) : null;
    } catch (e) {
      throw new CliError(`Cannot read ${path}: ${(e as Error).message}`);
    }
    try {
      return await readOne(path, bytes ?? file, options);
    } finally {
      file.close();
    }
  },
};

async function readOne(
  name: string,
  input: Uint8Array | ImageFile,
  options: ReturnType<typeof parseOptions>["options"],
) {
  const whole = () => (isImageFile(input) ? readFileSync(input.path) : input);
  const kind = sniffFileKind(isImageFile(input) ? input.read(0, SNIFF_BYTES) : input);
  const pixelSize = num(options["pixel-size"], "pixel-size");
  try {
    if (kind === "csv" || kind === "tsv" || kind === "xlsx") {
      const read = readSpacingFromGrid(await readTableGrid(whole(), str(options.sheet, "sheet")), {
        columns: {
          x: str(options.x, "x"),
          y: str(options.y, "y"),
          position: str(options.position, "position"),
          spacing: str(options.spacing, "spacing"),
        },
        unit: str(options.unit, "unit") as TableUnit | undefined,
        pixelSizeUm: pixelSize,
      });
      const table = { ...read.table, columnsTaken: read.columnsTaken, unit: read.mapping.unit };
      return { json: { file: name, fileKind: kind, ...table }, text: JSON.stringify(table, null, 2) };
    }
    if (!kind)
      throw new CliError("The file is neither a PNG, JPEG or TIFF image nor a CSV/TSV or XLSX table.", "unsupported");
    const ch = str(options.channel, "channel");
    const channel = ch === undefined || ch === "luminance" ? "luminance" : num(ch, "channel")!;
    let roi;
    const roiText = str(options.roi, "roi");
    if (roiText) {
      const p = roiText.split(",").map(Number);
      if (p.length !== 4 || p.some((v) => !Number.isFinite(v)))
        throw new CliError(`--roi needs x,y,w,h in pixels (got ${roiText}).`);
      roi = { kind: "rect" as const, x: p[0], y: p[1], width: p[2], height: p[3] };
    }
    // Above what is held at full resolution, the ROI (or the whole image) is read reduced by the
    // readout's own binning factor, as the server does; lengths in pixels are given back in source pixels.
    const layout = await readImageLayout(input);
    const large = !!layout && layout.width * layout.height > MAX_FULL_RESOLUTION_PIXELS;
    const { image, info } = await decodeImage(
      input,
      large
        ? {
            channel,
            region: roi ? { x: roi.x, y: roi.y, width: roi.width, height: roi.height } : null,
            maxSidePx: DEFAULT_MAX_ANALYSIS_SIDE_PX,
          }
        : { channel },
    );
    const factor = large ? info.reduceFactor : 1;
    const pixelSizeUm = pixelSize ?? info.pixelSizeUm;
    installSpectrumThreads(options.threads);
    const read = readWavelength(image, {
      pixelSizeUm: pixelSizeUm === null || pixelSizeUm === undefined ? pixelSizeUm : pixelSizeUm * factor,
      roi: large ? undefined : roi,
      invert: options.invert === true,
    });
    const inSource = (v: number | null) => (v === null ? null : v * factor);
    const r = {
      ...read,
      wavelengthPx: inSource(read.wavelengthPx),
      uncertaintyPx: inSource(read.uncertaintyPx),
      warnings: [...info.notes, ...read.warnings],
    };
    const json = {
      file: name,
      fileKind: kind,
      format: info.format,
      widthPx: info.width,
      heightPx: info.height,
      channels: info.channels,
      bitDepth: info.bitDepth,
      pixelSizeUm,
      pixelSizeSource: pixelSize !== undefined ? "option" : info.pixelSizeSource,
      periodFound: r.periodFound,
      wavelengthUm: r.wavelengthUm,
      wavelengthPx: r.wavelengthPx,
      uncertaintyUm: r.uncertaintyUm,
      uncertaintyPx: r.uncertaintyPx,
      uncertaintyMethod: r.uncertaintyMethod,
      significance: r.significance,
      significanceThreshold: r.significanceThreshold,
      orientationDeg: r.orientationDeg,
      anisotropy: r.anisotropy,
      symmetry: r.symmetry,
      symmetryScores: r.symmetryScores,
      nearestNeighbourUm: r.nearestNeighbourUm,
      nearestNeighbourUncertaintyUm: r.nearestNeighbourUncertaintyUm,
      autocorrelation: r.autocorrelation,
      warnings: [...(info.pixelSizeNote ? [info.pixelSizeNote] : []), ...r.warnings],
    };
    const text = r.periodFound
      ? `λ = ${formatPlusMinus(r.wavelengthUm!, r.uncertaintyUm, "µm")} (${formatPlusMinus(r.wavelengthPx!, r.uncertaintyPx, "px")}), 95 % interval ± ${formatPlain(r.expandedUncertainty95Um!, 2)} µm, ${r.symmetry}, significance ${formatPlain(r.significance, 3)}` +
        (r.nearestNeighbourUm ? `, nearest-neighbour a = ${r.nearestNeighbourUm.toPrecision(4)} µm` : "")
      : `No significant period (significance ${formatPlain(r.significance, 3)} < ${r.significanceThreshold}).`;
    return { json, text: [text, ...json.warnings.map((w) => `warning: ${w}`)].join("\n") };
  } catch (e) {
    throw toCliError(e);
  }
}

export default command;
