import { KineticsInputError } from "../../kinetics";
import { parseAssignments, parseAxis } from "../../kinetics/parse-cli-values";
import { computeTuringMapParallel } from "../../parallel";
import { classLabel, MAX_MAP_CELLS, MAX_MAP_WAVENUMBERS } from "../../stability";
import { CliError, parseOptions, type CliCommand } from "../command";
import { toCliError } from "../core-errors";
import { loadKinetics, numberOption } from "./dispersion";

const command: CliCommand = {
  name: "turing-map",
  summary: "Sweep two parameters and map where the kinetics is Turing unstable, with wavelengths",
  help: `Usage: cli turing-map --kinetics <id> --x name:min:max:n[:log] --y name:min:max:n[:log] [options] [--json]

Classifies every cell of an nx × ny parameter box, with the predicted wavelength 2π/k* per cell,
the fraction of the box that is Turing unstable (stable at k = 0, unstable at some k > 0), and
the cells and contour where the wavelength equals a target. "classes" holds bit flags per cell
(see "legend"); "counts" gives the cells of each exclusive class (stable, Turing, Turing with
Hopf, unstable at k = 0 with a peak at k > 0, wave, Hopf, unstable at k = 0, no steady state,
invalid) and adds up to nx × ny. Rows run in parallel on worker threads.

Options:
  --kinetics <id>          catalogue id (see \`cli kinetics list\`)
  --kinetics-file <path>   a lab kinetics definition (JSON) instead
  --x name:min:max:n[:log] first swept parameter, n cells, linear or log spacing
  --y name:min:max:n[:log] second swept parameter
  --set name=value,…       values of the other parameters (defaults otherwise)
  --wavenumbers <n>        k grid per cell (default 200, at most ${MAX_MAP_WAVENUMBERS})
  --target <λ>             wavelength to match (µm with --length-scale, else model units)
  --tolerance <t>          match when |λ − target| ≤ t (same unit; default 5 % of the target)
  --length-scale <µm>      ℓ: one model length unit in µm (non-dimensional kinetics)
  --time-scale <s>         τ: one model time unit in s
  --workers <n>            worker threads (default: available cores, at most 8; 0 = in-process)
  --time-limit <ms>        stop with an error after this long (default 60000)
  --summary                omit the per-cell arrays from the JSON
  --json                   print one JSON object: per-cell arrays are row-major (index iy·nx + ix),
                           wavelength in model units (wavelengthUm when a length scale is given),
                           null where no mode grows

Limit: at most ${MAX_MAP_CELLS} cells.`,
  async run(args) {
    const { options } = parseOptions(args, ["summary"]);
    try {
      const kinetics = loadKinetics(options);
      if (typeof options.x !== "string" || typeof options.y !== "string")
        throw new CliError("--x and --y are required, each name:min:max:n[:log].");
      const target = numberOption(options, "target");
      const tolerance = numberOption(options, "tolerance");
      if (tolerance !== undefined && target === undefined)
        throw new KineticsInputError("tolerance", "--tolerance needs --target.");
      const source =
        typeof options["kinetics-file"] === "string"
          ? { definition: JSON.parse((await import("node:fs")).readFileSync(options["kinetics-file"], "utf8")) }
          : { catalogue: kinetics.id };
      const workers = numberOption(options, "workers");
      const r = await computeTuringMapParallel(
        source,
        {
          x: parseAxis(options.x, "x"),
          y: parseAxis(options.y, "y"),
          parameters: typeof options.set === "string" ? parseAssignments(options.set) : {},
          wavenumbers: numberOption(options, "wavenumbers"),
          target: target === undefined ? undefined : { wavelength: target, tolerance: tolerance ?? 0.05 * target },
          lengthScaleUm: numberOption(options, "length-scale"),
          timeScaleS: numberOption(options, "time-scale"),
          timeLimitMs: numberOption(options, "time-limit"),
        },
        workers === undefined ? {} : { workers },
      );
      const ell = r.lengthScaleUm;
      const nullable = (a: Float64Array, f = 1) => Array.from(a, (v) => (Number.isNaN(v) ? null : v * f));
      const summary = {
        kinetics: r.kinetics,
        x: r.x,
        y: r.y,
        nx: r.nx,
        ny: r.ny,
        legend: r.legend,
        lengthScaleUm: ell,
        timeScaleS: r.timeScaleS,
        turingFraction: r.turingFraction,
        counts: r.counts,
        target: r.target && {
          wavelength: r.target.wavelength,
          tolerance: r.target.tolerance,
          wavelengthUm: ell === null ? null : r.target.wavelength * ell,
          toleranceUm: ell === null ? null : r.target.tolerance * ell,
          matchCount: r.target.matchCount,
          contour: r.target.contour,
          ...(options.summary ? {} : { match: Array.from(r.target.match) }),
        },
        elapsedMs: r.elapsedMs,
        workers: r.workers,
      };
      const json = options.summary
        ? summary
        : {
            ...summary,
            classes: Array.from(r.classes),
            wavelength: nullable(r.wavelength),
            wavelengthUm: ell === null ? null : nullable(r.wavelength, ell),
            sigmaStar: nullable(r.sigmaStar),
          };
      const labels = Object.entries(r.counts)
        .filter(([, c]) => c > 0)
        .map(([k, c]) => `${k} ${c}`)
        .join(", ");
      const text =
        `${r.kinetics.name}: ${r.nx} × ${r.ny} cells over ${r.x.name} × ${r.y.name} in ${r.elapsedMs} ms (${r.workers} workers)\nTuring fraction ${(100 * r.turingFraction).toFixed(2)} %; ${labels}` +
        (r.target
          ? `\ncells within target: ${r.target.matchCount}; contour segments: ${r.target.contour.length}`
          : "") +
        `\nlegend of the bit flags: ${Object.keys(r.legend)
          .map((k) => `${k}=${r.legend[k]}`)
          .join(", ")} (3 = ${classLabel(3)})`;
      return { json, text };
    } catch (err) {
      throw toCliError(err);
    }
  },
};
export default command;
