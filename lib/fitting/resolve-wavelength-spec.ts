import { FitError } from "./errors";
import type {
  MeasurementKind,
  ParameterSetting,
  WavelengthDatum,
  WavelengthFitOptions,
  WavelengthFitSpec,
} from "./wavelength-spec";

/** Fourier wavelength of hexagonal spots from their nearest-neighbour spacing: λ = (√3/2)·a (SCIENCE.md §4). */
export const HEX_SPACING_TO_FOURIER = Math.sqrt(3) / 2;

/** One fitted coordinate: a free parameter, or a per-condition parameter for one condition. */
export interface FreeSlot {
  /** `Du`, or `k[treated]` for a per-condition parameter. */
  label: string;
  parameter: string;
  condition: string | null;
  start: number;
  lower: number;
  upper: number;
  log: boolean;
}

/** A datum with its value on the Fourier scale the model predicts. */
export interface ResolvedDatum<TDomain> extends WavelengthDatum<TDomain> {
  fourierUm: number;
  fourierUncertaintyUm: number;
}

export interface ResolvedWavelengthSpec<TDomain> {
  data: ResolvedDatum<TDomain>[];
  /** Conditions in order of first appearance. */
  conditions: string[];
  slots: FreeSlot[];
  parameterNames: string[];
  settings: Record<string, ParameterSetting>;
  options: Required<WavelengthFitOptions>;
}

const bad = (field: string, message: string) => new FitError("bad_option", message, field);
const badData = (field: string, message: string) => new FitError("bad_data", message, field);
const KINDS: MeasurementKind[] = ["fourier", "nearest-neighbour"];

function checkData<TDomain>(data: WavelengthDatum<TDomain>[]): ResolvedDatum<TDomain>[] {
  if (!Array.isArray(data) || data.length === 0)
    throw badData("data", "data must hold at least one measurement; got none.");
  const kindOf = new Map<string, MeasurementKind>();
  return data.map((d, i) => {
    const f = `data[${i}]`;
    if (typeof d.condition !== "string" || d.condition.trim() === "")
      throw badData(`${f}.condition`, `${f}.condition must be a non-empty string.`);
    if (!(d.wavelengthUm > 0) || !Number.isFinite(d.wavelengthUm))
      throw badData(`${f}.wavelengthUm`, `${f}.wavelengthUm must be a positive number of µm; got ${d.wavelengthUm}.`);
    if (!(d.uncertaintyUm > 0) || !Number.isFinite(d.uncertaintyUm))
      throw badData(
        `${f}.uncertaintyUm`,
        `${f}.uncertaintyUm must be a positive number of µm; got ${d.uncertaintyUm}.`,
      );
    if (!KINDS.includes(d.kind))
      throw badData(`${f}.kind`, `${f}.kind must be "fourier" or "nearest-neighbour"; got "${d.kind}".`);
    const seen = kindOf.get(d.condition);
    if (seen && seen !== d.kind)
      throw badData(
        `${f}.kind`,
        `${f}.kind is "${d.kind}" but condition "${d.condition}" also has "${seen}" measurements; use one kind per condition (the spacing conversion assumes hexagonal spots, which a condition mixing both kinds does not establish).`,
      );
    kindOf.set(d.condition, d.kind);
    const factor = d.kind === "nearest-neighbour" ? HEX_SPACING_TO_FOURIER : 1;
    return { ...d, fourierUm: d.wavelengthUm * factor, fourierUncertaintyUm: d.uncertaintyUm * factor };
  });
}

function checkFinite(field: string, v: unknown): number {
  if (typeof v !== "number" || !Number.isFinite(v)) throw bad(field, `${field} must be a finite number; got ${v}.`);
  return v;
}

function checkBox(name: string, s: { lower: number; upper: number; log?: boolean }): void {
  const f = `parameters.${name}`;
  checkFinite(`${f}.lower`, s.lower);
  checkFinite(`${f}.upper`, s.upper);
  if (!(s.lower < s.upper)) throw bad(`${f}.lower`, `${f}.lower (${s.lower}) must be below ${f}.upper (${s.upper}).`);
  if (s.log && !(s.lower > 0))
    throw bad(`${f}.lower`, `${f}.lower must be positive for a log-scaled parameter; got ${s.lower}.`);
}

function checkStart(field: string, v: unknown, lower: number, upper: number): number {
  const x = checkFinite(field, v);
  if (x < lower || x > upper)
    throw bad(field, `${field} (${x}) must lie within [lower, upper] = [${lower}, ${upper}].`);
  return x;
}

function perCondition(
  field: string,
  v: number | Record<string, number>,
  conditions: string[],
  check: (f: string, x: unknown) => number,
): Record<string, number> {
  if (typeof v === "number") return Object.fromEntries(conditions.map((c) => [c, check(field, v)]));
  if (typeof v !== "object" || v === null)
    throw bad(field, `${field} must be a finite number or one finite number per condition.`);
  return Object.fromEntries(
    conditions.map((c) => {
      if (!(c in v)) throw bad(field, `${field} has no value for condition "${c}".`);
      return [c, check(`${field}.${c}`, v[c])];
    }),
  );
}

function checkOptions(o: WavelengthFitOptions = {}): Required<WavelengthFitOptions> {
  const int = (name: string, v: number, lo: number, hi: number) => {
    if (!Number.isInteger(v) || v < lo || v > hi)
      throw bad(`options.${name}`, `options.${name} must be an integer from ${lo} to ${hi}; got ${v}.`);
    return v;
  };
  const reachSigma = o.reachSigma ?? 3;
  if (!(reachSigma > 0) || !Number.isFinite(reachSigma))
    throw bad("options.reachSigma", `options.reachSigma must be a positive number; got ${reachSigma}.`);
  const valleyPoints = o.valleyPoints ?? 21;
  if (valleyPoints !== 0) int("valleyPoints", valleyPoints, 3, 1000);
  return {
    seededStarts: int("seededStarts", o.seededStarts ?? 4, 0, 100),
    turingSamples: int("turingSamples", o.turingSamples ?? 64, 0, 10000),
    seed: o.seed ?? "morphokin",
    absoluteUncertainties: o.absoluteUncertainties ?? true,
    profiles: o.profiles ?? true,
    reachSigma,
    valleyPoints,
  };
}

/** Validate a wavelength-fit spec once, convert spacings to Fourier wavelengths, lay out the free coordinates. */
export function resolveWavelengthSpec<TDomain>(spec: WavelengthFitSpec<TDomain>): ResolvedWavelengthSpec<TDomain> {
  const data = checkData(spec.data);
  const conditions = [...new Set(data.map((d) => d.condition))];
  const names = Object.keys(spec.parameters ?? {});
  if (names.length === 0) throw bad("parameters", "parameters must name at least one parameter; got none.");
  const slots: FreeSlot[] = [];
  const settings: Record<string, ParameterSetting> = {};
  for (const name of names) {
    const s = spec.parameters[name];
    const f = `parameters.${name}`;
    if (s.mode === "fixed") {
      settings[name] = {
        mode: "fixed",
        value:
          typeof s.value === "number"
            ? checkFinite(`${f}.value`, s.value)
            : perCondition(`${f}.value`, s.value, conditions, checkFinite),
      };
    } else if (s.mode === "free") {
      checkBox(name, s);
      const start = checkStart(`${f}.start`, s.start, s.lower, s.upper);
      slots.push({
        label: name,
        parameter: name,
        condition: null,
        start,
        lower: s.lower,
        upper: s.upper,
        log: s.log ?? false,
      });
      settings[name] = s;
    } else if (s.mode === "per-condition") {
      checkBox(name, s);
      const starts = perCondition(`${f}.start`, s.start, conditions, (field, x) =>
        checkStart(field, x, s.lower, s.upper),
      );
      for (const c of conditions)
        slots.push({
          label: `${name}[${c}]`,
          parameter: name,
          condition: c,
          start: starts[c],
          lower: s.lower,
          upper: s.upper,
          log: s.log ?? false,
        });
      settings[name] = s;
    } else {
      throw bad(
        `${f}.mode`,
        `${f}.mode must be "fixed", "free" or "per-condition"; got "${(s as { mode?: string }).mode}".`,
      );
    }
  }
  if (slots.length === 0)
    throw bad("parameters", `parameters must leave at least one free parameter; all ${names.length} are fixed.`);
  return { data, conditions, slots, parameterNames: names, settings, options: checkOptions(spec.options) };
}

/** The named parameter values one condition sees, given the free coordinates. */
export function valuesForCondition<TDomain>(
  spec: ResolvedWavelengthSpec<TDomain>,
  free: readonly number[],
  condition: string,
): Record<string, number> {
  const out: Record<string, number> = {};
  for (const name of spec.parameterNames) {
    const s = spec.settings[name];
    if (s.mode === "fixed") out[name] = typeof s.value === "number" ? s.value : s.value[condition];
  }
  spec.slots.forEach((slot, j) => {
    if (slot.condition === null || slot.condition === condition) out[slot.parameter] = free[j];
  });
  return out;
}
