import { readFileSync } from "node:fs";
import { compileKinetics, getCatalogueKinetics, type CompiledKinetics } from "../../kinetics";
import { parseAssignments, parseDomain } from "../../kinetics/parse-cli-values";
import { computeDispersion, type DomainSpec } from "../../stability";
import { CliError, parseOptions, type CliCommand } from "../command";
import { toCliError } from "../core-errors";

/** Shared with turing-map: --kinetics <id> or --kinetics-file <definition.json>. */
export function loadKinetics(options: Record<string, string | true>): CompiledKinetics {
  if (typeof options["kinetics-file"] === "string") {
    let json: unknown;
    try {
      json = JSON.parse(readFileSync(options["kinetics-file"], "utf8"));
    } catch (err) {
      throw new CliError(`--kinetics-file: cannot read JSON: ${(err as Error).message}`);
    }
    return compileKinetics(json);
  }
  if (typeof options.kinetics !== "string")
    throw new CliError(
      "--kinetics <id> (or --kinetics-file <definition.json>) is required; run `cli kinetics list` for the ids.",
    );
  return getCatalogueKinetics(options.kinetics);
}

/** Number-valued option or undefined. */
export function numberOption(options: Record<string, string | true>, name: string): number | undefined {
  const v = options[name];
  if (v === undefined) return undefined;
  const x = Number(v);
  if (v === true || !Number.isFinite(x)) throw new CliError(`--${name} needs a finite number (got ${String(v)}).`);
  return x;
}

const command: CliCommand = {
  name: "dispersion",
  summary: "Dispersion relation, classification and predicted wavelength of one kinetics",
  help: `Usage: cli dispersion --kinetics <id> [options] [--json]

Linear stability of the homogeneous steady state: classification (stable, Turing, Hopf,
wave, unstable at k = 0), fastest-growing wavenumber k*, growth rate σ(k*), unstable band,
predicted wavelength 2π/k*, closed-form Turing conditions (2 species), and on a bounded
domain the fastest admissible mode and how many repeats it lays down.

Options:
  --kinetics <id>          catalogue id (see \`cli kinetics list\`)
  --kinetics-file <path>   a lab kinetics definition (JSON, KineticsDefinition) instead
  --set name=value,…       parameter values (others keep their defaults)
  --domain <spec>          interval:L | rectangle:Lx,Ly | sphere:R  (µm when --length-scale
                           is given or the kinetics is dimensional, else model units)
  --domain-units um|model  override the unit of the domain sizes
  --length-scale <µm>      ℓ: one model length unit in µm (non-dimensional kinetics)
  --time-scale <s>         τ: one model time unit in s (non-dimensional kinetics)
  --steady-state <i>       index of the steady state to analyse (default: auto — the first
                           state stable without diffusion that is Turing unstable)
  --grid <n>               wavenumbers in the k grid (default 200)
  --k-max <k>              upper end of the k grid, model units⁻¹ (default automatic)
  --curve                  include σ(k) on the grid in the output
  --json                   print one JSON object; field names carry units
                           (kStarPerUm, wavelengthUm, growthRatePerS; plain names are model units)`,
  async run(args) {
    const { options } = parseOptions(args, ["curve"]);
    try {
      const kinetics = loadKinetics(options);
      const set = typeof options.set === "string" ? parseAssignments(options.set) : {};
      let domain: DomainSpec | undefined;
      if (typeof options.domain === "string") {
        const units = options["domain-units"];
        if (units !== undefined && units !== "um" && units !== "model")
          throw new CliError("--domain-units must be um or model.");
        domain = { ...parseDomain(options.domain), ...(units ? { units } : {}) } as DomainSpec;
      }
      const ss = options["steady-state"];
      const r = computeDispersion(kinetics, set, {
        domain,
        lengthScaleUm: numberOption(options, "length-scale"),
        timeScaleS: numberOption(options, "time-scale"),
        steadyState: ss === undefined || ss === "auto" ? "auto" : Number(ss),
        gridSize: numberOption(options, "grid"),
        kMax: numberOption(options, "k-max"),
      });
      const { curve, ...rest } = r;
      const json = options.curve ? r : rest;
      const f = r.fastest;
      const text = [
        `${r.kinetics.name}: ${r.classification.label}`,
        `steady state ${JSON.stringify(r.steadyState.values)}`,
        f
          ? `k* = ${f.kStar.toPrecision(6)}, σ(k*) = ${f.sigmaStar.toPrecision(6)}, λ* = 2π/k* = ${f.wavelength.toPrecision(6)}${f.wavelengthUm !== null ? ` (${f.wavelengthUm.toPrecision(6)} µm)` : ""}`
          : "no growing mode at k > 0",
        r.turingConditions?.criticalRatio
          ? `critical ratio d_c = ${r.turingConditions.criticalRatio.toPrecision(6)}, k_c = ${r.turingConditions.criticalWavenumber?.toPrecision(6)}`
          : "",
        r.domain
          ? `domain: fastest mode ${JSON.stringify(r.domain.fastestMode.indices)} ${JSON.stringify(r.domain.fastestMode.repeats)}, patterning expected: ${r.domain.patterningExpected}`
          : "",
      ]
        .filter(Boolean)
        .join("\n");
      void curve;
      return { json, text };
    } catch (err) {
      throw toCliError(err);
    }
  },
};
export default command;
