/**
 * A message about a field, in the form's words: the JSON name the schemas and the science core
 * begin their messages with (`models[1].lengthScaleUm (µm) must be above 0`, `endTimeS must be
 * above 0`, `definition.reactions[1] does not parse: …`) becomes the field's label ("Length scale
 * of the second kinetics (µm) must be above 0"), and the few JSON names messages use in passing
 * become plain words. Pure: the route glue calls it, the command line keeps the JSON names
 * (they are what a FIT.json or RUN.json holds).
 */
import { labelField, type FieldLabelContext } from "./field-labels";

/** JSON names that messages mention in passing, as a person says them. Longest first. */
const IN_PASSING: [string, string][] = [
  ["endTimeS / dtS", "Simulated time divided by the step cap"],
  ["lengthScaleUm", "length scale"],
  ["timeScaleS", "time scale"],
  ["uncertaintyUm", "uncertainty"],
  ["wavelengthUm", "wavelength"],
  ["readoutId", "readout"],
  ["pixelSizeUm", "pixel size"],
  ["endTimeS", "simulated time"],
];

/** A JSON name at the start of a message: `a.b[0].c`, `a.b.0.c`, `x[i]`, `roi point x`. */
const LEADING_NAME = /^[A-Za-z_]\w*(?:\[[^\]\s]*\]|\.\w+)*/;
/** A unit right after the name, which the label already carries. */
const UNIT_AFTER_NAME = /^\s*\((?:µm|s|µm\/px|µm per pixel|model units)\)/;
/** What follows a bare one-word name when the message begins with it (not "name the fit"). */
const AFTER_BARE_NAME = /^(?::|\s+(?:must|is|are|has|have|does|nests|should|needs|=|may|cannot))/;

const hasCapitalInside = (name: string) => /[A-Z]/.test(name.slice(1));

/** The message without its leading JSON name (and the unit after it), or null when it has none. */
function stripLeadingName(message: string, pathNames: Set<string>): string | null {
  const m = LEADING_NAME.exec(message);
  if (!m) return null;
  const name = m[0];
  const rest = message.slice(name.length).replace(UNIT_AFTER_NAME, "");
  if (/[.[]/.test(name)) return rest;
  // A plain word ("data", "kind") is a JSON name only when it is a key of this path and, unless it
  // is camelCase, the message reads on as a statement about it ("name the fit" begins with a verb).
  if (!pathNames.has(name)) return null;
  return hasCapitalInside(name) || AFTER_BARE_NAME.test(rest) ? rest : null;
}

/** The message without a beginning that says the label's words already ("pixel size must …"). */
function stripLabelWords(message: string, label: string): string | null {
  const words = label.replace(/\s*\([^)]*\)$/, "").toLowerCase();
  if (words.length < 3 || !message.toLowerCase().startsWith(words)) return null;
  const rest = message.slice(words.length);
  return /^[\s:]/.test(rest) || rest === "" ? rest.replace(UNIT_AFTER_NAME, "") : null;
}

function replaceInPassing(message: string): string {
  let out = message;
  for (const [name, words] of IN_PASSING) out = out.split(name).join(words);
  return out;
}

/**
 * `message` about the field at `path`, beginning with the field's label. A message that names
 * no field first is given the label as a prefix ("Name: name the fit" reads oddly but says where);
 * a path without a label leaves the message as it was.
 */
export function describeFieldMessage(
  path: string | readonly PropertyKey[] | undefined | null,
  message: string,
  context: FieldLabelContext = {},
): string {
  if (path === undefined || path === null || (typeof path !== "string" && path.length === 0) || path === "") {
    return message;
  }
  const label = labelField(path, context);
  if (!label) return message;
  if (message.startsWith(label)) return message;
  const names = new Set((typeof path === "string" ? path.split(/[.[\]]+/) : path.map(String)).filter(Boolean));
  const stripped = stripLeadingName(message, names) ?? stripLabelWords(message, label);
  const rest = replaceInPassing(stripped ?? message).trimStart();
  if (stripped === null) return `${label}: ${rest}`;
  if (rest.startsWith(":")) {
    // "pixelSizeUm: pixel size must be above 0" says its field twice once the name is a label.
    const after = rest.slice(1).trimStart();
    const again = stripLabelWords(after, label);
    return again === null ? `${label}: ${after}` : `${label}${again.startsWith(":") ? "" : " "}${again.trimStart()}`;
  }
  return rest === "" ? label : `${label} ${rest}`;
}

/**
 * A message already written about `path` whose leading JSON name, if any, becomes the label; a
 * message that begins in plain words ("Plane 3 does not exist: …") is kept as it is.
 */
export function renameFieldInMessage(
  path: string | readonly PropertyKey[] | undefined | null,
  message: string,
  context: FieldLabelContext = {},
): string {
  if (path === undefined || path === null || path.length === 0) return message;
  const label = labelField(path, context);
  if (!label || message.startsWith(label)) return message;
  const names = new Set((typeof path === "string" ? path.split(/[.[\]]+/) : path.map(String)).filter(Boolean));
  const stripped = stripLeadingName(message, names);
  if (stripped === null) return replaceInPassing(message);
  return describeFieldMessage(path, message, context);
}

/** The species and parameter names of a request that carries a kinetics definition, for its labels. */
export function fieldLabelContextOf(body: unknown): FieldLabelContext {
  const definition = (body as { definition?: unknown } | null)?.definition ?? body;
  if (typeof definition !== "object" || definition === null) return {};
  const { species, parameters } = definition as { species?: unknown; parameters?: unknown };
  return {
    species: Array.isArray(species) ? species.map((s) => (typeof s === "string" ? s : "")) : undefined,
    parameters: Array.isArray(parameters)
      ? parameters.map((p) => (typeof (p as { name?: unknown })?.name === "string" ? (p as { name: string }).name : ""))
      : undefined,
  };
}

/** `["models", 1, "lengthScaleUm"]` → `models[1].lengthScaleUm`: the machine field of an error answer. */
export function formatFieldPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>(
    (out, s) => (typeof s === "number" ? `${out}[${s}]` : out === "" ? String(s) : `${out}.${String(s)}`),
    "",
  );
}
