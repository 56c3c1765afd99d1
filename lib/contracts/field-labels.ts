/**
 * The one map from a field path of the forms' request bodies (fit, verification run, kinetics
 * and its analyses, readout settings, uploads and batches) to the words the form shows beside
 * that field. Error messages name a field by this label ("Length scale of the second kinetics
 * (µm)"), never by its JSON name (`models[1].lengthScaleUm`); the JSON error keeps the machine
 * `field` for the forms to highlight. Positions are counted from 1, as a person counts.
 *
 * A pattern's segments: a key, `#` for any list position, `*` for any name (a parameter, a
 * condition). Captured positions and names are handed to the label, in order.
 * `tests/lib/contracts/field-labels.test.ts` walks every form schema and fails on a path
 * without a label here.
 */
import { ordinal, splitFieldPath, type PathSegment } from "./field-path";

/** What a label may need from the request itself: the species and parameter names of a definition. */
export interface FieldLabelContext {
  species?: readonly string[];
  parameters?: readonly string[];
}

type Captured = (string | number)[];
type Label = string | ((captured: Captured, context: FieldLabelContext) => string);

const nth = (c: Captured, k = 0) => ordinal(Number(c[k]));
const num = (c: Captured, k = 0) => Number(c[k]) + 1;
const speciesName = (ctx: FieldLabelContext, i: number) => ctx.species?.[i]?.trim() || null;
const parameterName = (ctx: FieldLabelContext, i: number) => ctx.parameters?.[i]?.trim() || null;

/** "Equation for du/dt" when the species are known, "Equation 2 (dB/dt)" otherwise. */
function equation(c: Captured, ctx: FieldLabelContext): string {
  const s = speciesName(ctx, Number(c[0]));
  return s ? `Equation for d${s}/dt` : `Equation ${num(c)} (the ${nth(c)} species)`;
}
function diffusivity(c: Captured, ctx: FieldLabelContext): string {
  const s = speciesName(ctx, Number(c[0]));
  return s ? `Diffusivity of ${s}` : `Diffusivity of the ${nth(c)} species`;
}
function crossDiffusion(c: Captured, ctx: FieldLabelContext): string {
  const [a, b] = [speciesName(ctx, Number(c[0])), speciesName(ctx, Number(c[1]))];
  return a && b ? `Diffusion of ${a} by ${b}` : `Diffusion matrix, row ${num(c)}, column ${num(c, 1)}`;
}
function definitionParameter(what: string) {
  return (c: Captured, ctx: FieldLabelContext) => {
    const p = parameterName(ctx, Number(c[0]));
    return p ? `${what} of parameter ${p}` : `${what} of parameter ${num(c)}`;
  };
}
/** A setting of one parameter of a fit's kinetics: "Lower bound of gamma in the second kinetics". */
const fitParameter = (what: string) => (c: Captured) => `${what} of ${c[1]} in the ${nth(c)} kinetics`;
const perCondition = (what: string) => (c: Captured) =>
  `${what} of ${c[1]} for condition “${c[2]}” in the ${nth(c)} kinetics`;
/** The gradient profile: in a run's `gradient.profile` and in a gradient analysis's `profile`. */
const PROFILE: [string, Label][] = [
  ["", "Gradient profile"],
  [".kind", "Gradient shape"],
  [".from", "Value at x = 0"],
  [".to", "Value at x = L"],
  [".source", "Value at the source"],
  [".decayLength", "Decay length"],
  [".floor", "Floor value"],
  [".text", "Position, value table"],
];
const AXIS = (prefix: "x" | "y", side: string): [string, Label][] => [
  [prefix, `${side} axis`],
  [`${prefix}.name`, `Parameter on the ${side.toLowerCase()} axis`],
  [`${prefix}.min`, `${side} axis from`],
  [`${prefix}.max`, `${side} axis to`],
  [`${prefix}.n`, `Cells along the ${side.toLowerCase()} axis`],
  [`${prefix}.scale`, `Scale of the ${side.toLowerCase()} axis`],
];

const ENTRIES: [string, Label][] = [
  // Shared by several forms.
  ["name", "Name"],
  ["description", "Description"],
  ["kinetics", "Kinetics"],
  ["version", "Version"],
  ["parameters", "Parameter values"],
  ["parameters.*", (c) => `Parameter ${c[0]}`],
  ["lengthScaleUm", "Length scale ℓ (µm)"],
  ["timeScaleS", "Time scale τ (s)"],
  ["seed", "Seed"],
  ["condition", "Condition"],
  ["pixelSizeUm", "Pixel size (µm per pixel)"],
  // Fit builder.
  ["data", "Measurements"],
  ["data.#", (c) => `Measurement ${num(c)}`],
  ["data.#.readoutId", (c) => `Readout of measurement ${num(c)}`],
  ["data.#.condition", (c) => `Condition of measurement ${num(c)}`],
  ["data.#.kind", (c) => `Kind of measurement ${num(c)}`],
  ["data.#.wavelengthUm", (c) => `Wavelength of measurement ${num(c)} (µm)`],
  ["data.#.uncertaintyUm", (c) => `Uncertainty of measurement ${num(c)} (µm)`],
  ["data.#.domain", (c) => `Tissue size of measurement ${num(c)}`],
  ["data.#.domain.kind", (c) => `Tissue shape of measurement ${num(c)}`],
  ["data.#.domain.length", (c) => `Tissue length of measurement ${num(c)} (µm)`],
  ["data.#.domain.lx", (c) => `Tissue length Lx of measurement ${num(c)} (µm)`],
  ["data.#.domain.ly", (c) => `Tissue width Ly of measurement ${num(c)} (µm)`],
  ["models", "Kinetics to fit"],
  ["models.#", (c) => `The ${nth(c)} kinetics`],
  ["models.#.kinetics", (c) => `The ${nth(c)} kinetics`],
  ["models.#.version", (c) => `Version of the ${nth(c)} kinetics`],
  ["models.#.label", (c) => `Label of the ${nth(c)} kinetics`],
  ["models.#.lengthScaleUm", (c) => `Length scale of the ${nth(c)} kinetics (µm)`],
  ["models.#.timeScaleS", (c) => `Time scale of the ${nth(c)} kinetics (s)`],
  ["models.#.gridSize", (c) => `Grid size of the ${nth(c)} kinetics`],
  ["models.#.parameters", (c) => `Parameters of the ${nth(c)} kinetics`],
  ["models.#.parameters.*", (c) => `Parameter ${c[1]} of the ${nth(c)} kinetics`],
  ["models.#.parameters.*.mode", fitParameter("Setting")],
  ["models.#.parameters.*.value", fitParameter("Value")],
  ["models.#.parameters.*.value.*", perCondition("Value")],
  ["models.#.parameters.*.start", fitParameter("Start value")],
  ["models.#.parameters.*.start.*", perCondition("Start value")],
  ["models.#.parameters.*.lower", fitParameter("Lower bound")],
  ["models.#.parameters.*.upper", fitParameter("Upper bound")],
  ["models.#.parameters.*.log", fitParameter("Log scale")],
  ["options", "Options"],
  ["options.seededStarts", "Seeded starts"],
  ["options.turingSamples", "Turing samples"],
  ["options.seed", "Seed"],
  ["options.absoluteUncertainties", "Uncertainties are absolute"],
  ["options.profiles", "95 % profile-likelihood intervals"],
  ["options.reachSigma", "Reach of the profiles (σ)"],
  ["options.valleyPoints", "Points along each profile"],
  ["uncertainty", "Uncertainty of each condition"],
  ["replicates", "Replicates"],
  // A fit or run changed from an earlier one (its page links back).
  ["changedFrom", "Changed from"],
  // Verification run.
  ["grid", "Simulated tissue"],
  ["grid.lengthUm", "Tissue size"],
  ["grid.lengthUm.#", (c) => (Number(c[0]) === 0 ? "Tissue length L (Lx)" : "Tissue width Ly")],
  ["grid.cells", "Cells per axis"],
  ["grid.cells.#", "Cells per axis"],
  ["grid.boundary", "Boundary"],
  ["endTimeS", "Simulated time"],
  ["dtS", "Step cap (largest time step)"],
  ["scheme", "Time-stepping scheme"],
  ["stopWhenStationary", "Stop when the pattern is stationary"],
  ["timeStepping", "Time steps (adaptive or fixed)"],
  ["tolerance", "Error tolerance of adaptive steps"],
  ["startFrom", "Start from"],
  ["startFrom.runId", "Start from (an earlier run)"],
  ["noiseAmplitude", "Noise amplitude"],
  ["snapshots", "Snapshots"],
  ["gradient", "Gradient"],
  ["gradient.parameter", "Parameter that varies"],
  ...PROFILE.map(([k, l]): [string, Label] => [`gradient.profile${k}`, l]),
  ["fit", "Fit to simulate"],
  ["fit.fitId", "Fit to simulate"],
  ["fit.model", "Kinetics of the fit"],
  ["fit.condition", "Condition of the fit"],
  // Lab kinetics (editor).
  ["definition", "Kinetics definition"],
  ["definition.id", "Short id"],
  ["definition.name", "Name"],
  ["definition.source", "Source"],
  ["definition.units", "Units"],
  ["definition.nonNegative", "Species are concentrations"],
  ["definition.species", "Species"],
  ["definition.species.#", (c) => `Name of species ${num(c)}`],
  ["definition.parameters", "Parameters"],
  ["definition.parameters.#", (c, ctx) => `Parameter ${parameterName(ctx, Number(c[0])) ?? num(c)}`],
  ["definition.parameters.#.name", (c) => `Name of parameter ${num(c)}`],
  ["definition.parameters.#.default", definitionParameter("Default")],
  ["definition.parameters.#.min", definitionParameter("Minimum")],
  ["definition.parameters.#.max", definitionParameter("Maximum")],
  ["definition.parameters.#.meaning", definitionParameter("Meaning")],
  ["definition.parameters.#.unit", definitionParameter("Unit")],
  ["definition.reactions", "Equations"],
  ["definition.reactions.#", equation],
  ["definition.diffusion", "Diffusion"],
  ["definition.diffusion.#", diffusivity],
  ["definition.diffusion.#.#", crossDiffusion],
  // Kinetics analyses: dispersion relation, Turing-space map, sensitivities, gradients.
  ["domain", "Domain"],
  ["domain.kind", "Domain shape"],
  ["domain.length", "Domain length"],
  ["domain.lx", "Domain length Lx"],
  ["domain.ly", "Domain width Ly"],
  ["domain.radius", "Sphere radius"],
  ["domain.units", "Domain units"],
  ["gridSize", "Wavenumbers in the plot"],
  ...AXIS("x", "Horizontal"),
  ...AXIS("y", "Vertical"),
  ["wavenumbers", "Wavenumbers per cell"],
  ["target", "Target"],
  ["target.wavelength", "Target wavelength"],
  ["target.tolerance", "Target tolerance"],
  ["scale", "Scaled parameter"],
  ["scale.name", "Scaled parameter"],
  ["scale.factor", "Scale factor"],
  ["parameter", "Parameter that varies"],
  ...PROFILE.map(([k, l]): [string, Label] => [`profile${k}`, l]),
  ["length", "Tissue length"],
  ["samples", "Positions along the tissue"],
  // Readout settings.
  ["roi", "Region of interest"],
  ["roi.kind", "Shape of the region of interest"],
  ["roi.x", "Left edge of the region (px)"],
  ["roi.y", "Top edge of the region (px)"],
  ["roi.width", "Width of the region (px)"],
  ["roi.height", "Height of the region (px)"],
  ["roi.points", "Outline of the region"],
  ["roi.points.#", (c) => `Point ${num(c)} of the region's outline`],
  ["roi.points.#.#", (c) => `${Number(c[1]) === 0 ? "x" : "y"} of point ${num(c)} of the region's outline (px)`],
  ["channel", "Channel"],
  ["plane", "Plane (z)"],
  ["timePoint", "Time point"],
  ["projection", "Projection"],
  ["invert", "Invert (dark spots on light)"],
  ["flatten", "Background flattening"],
  ["window", "Window"],
  ["tissueMask", "Tissue region"],
  ["profileAxis", "Axis of the local-wavelength profile"],
  ["columns", "Columns"],
  ["columns.x", "x column"],
  ["columns.y", "y column"],
  ["columns.position", "Position column"],
  ["columns.spacing", "Spacing column"],
  ["unit", "Unit of the table's numbers"],
  ["sheet", "Sheet"],
  // Uploads and batches.
  ["file", "File"],
  ["specimenId", "Specimen"],
  ["studyId", "Study"],
  ["specimenLabel", "Label of the new specimen"],
  ["stage", "Stage"],
  ["pixelSizeOverride", "Use this pixel size for every file"],
  // Account forms.
  ["email", "E-mail"],
  ["password", "Password"],
  ["currentPassword", "Current password"],
  ["newPassword", "New password"],
  ["labName", "Lab name"],
];

interface Pattern {
  segments: string[];
  label: Label;
}
const PATTERNS: Pattern[] = ENTRIES.map(([key, label]) => ({ segments: key.split("."), label }));

function match(pattern: string[], path: PathSegment[]): Captured | null {
  if (pattern.length !== path.length) return null;
  const captured: Captured = [];
  for (let i = 0; i < path.length; i++) {
    const p = pattern[i];
    const s = path[i];
    if (p === "#") {
      if (typeof s !== "number") return null;
      captured.push(s);
    } else if (p === "*") captured.push(s);
    else if (p !== String(s)) return null;
  }
  return captured;
}

/**
 * The form's words for a field path (`models[1].lengthScaleUm`, `models.1.lengthScaleUm` or a
 * zod issue path), or null when the path has none.
 */
export function labelField(path: string | readonly PropertyKey[], context: FieldLabelContext = {}): string | null {
  const segments = splitFieldPath(path);
  if (segments.length === 0) return null;
  // The first pattern that matches wins: exact keys come before `*`, as in the table.
  for (const p of PATTERNS) {
    const captured = match(p.segments, segments);
    if (captured) return typeof p.label === "string" ? p.label : p.label(captured, context);
  }
  return null;
}
