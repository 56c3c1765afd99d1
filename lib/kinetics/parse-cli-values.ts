/**
 * Parsers for the compact option strings of the command line and query strings:
 * `a=0.1,b=0.9`, `interval:L | rectangle:Lx,Ly | sphere:R`, `name:min:max:n[:log]`.
 */
import { KineticsInputError } from "./errors";

function toNumber(field: string, text: string): number {
  const v = Number(text);
  if (text.trim() === "" || !Number.isFinite(v))
    throw new KineticsInputError(field, `${field}: "${text}" is not a finite number.`);
  return v;
}

/** `a=0.1,b=0.9` → { a: 0.1, b: 0.9 }. */
export function parseAssignments(text: string, field = "set"): Record<string, number> {
  const out: Record<string, number> = {};
  for (const part of text
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean)) {
    const eq = part.indexOf("=");
    if (eq <= 0) throw new KineticsInputError(field, `${field}: "${part}" is not of the form name=value.`);
    const name = part.slice(0, eq).trim();
    out[name] = toNumber(`${field}.${name}`, part.slice(eq + 1).trim());
  }
  return out;
}

export type ParsedDomain =
  | { kind: "interval"; length: number }
  | { kind: "rectangle"; lx: number; ly: number }
  | { kind: "sphere"; radius: number };

/** `interval:L`, `rectangle:Lx,Ly` or `sphere:R`. */
export function parseDomain(text: string, field = "domain"): ParsedDomain {
  const [kind, rest = ""] = text.split(":");
  const nums = rest.split(",").map((s, i) => toNumber(`${field}[${i}]`, s));
  if (kind === "interval" && nums.length === 1) return { kind, length: nums[0] };
  if (kind === "rectangle" && nums.length === 2) return { kind, lx: nums[0], ly: nums[1] };
  if (kind === "sphere" && nums.length === 1) return { kind, radius: nums[0] };
  throw new KineticsInputError(field, `${field}: "${text}" must be interval:L, rectangle:Lx,Ly or sphere:R.`);
}

/** `name:min:max:n[:log]` → a map axis. */
export function parseAxis(
  text: string,
  field: string,
): { name: string; min: number; max: number; n: number; scale: "linear" | "log" } {
  const parts = text.split(":");
  if (parts.length < 4 || parts.length > 5 || (parts.length === 5 && parts[4] !== "log" && parts[4] !== "linear")) {
    throw new KineticsInputError(field, `${field}: "${text}" must be name:min:max:n or name:min:max:n:log.`);
  }
  const n = toNumber(`${field}.n`, parts[3]);
  return {
    name: parts[0],
    min: toNumber(`${field}.min`, parts[1]),
    max: toNumber(`${field}.max`, parts[2]),
    n,
    scale: parts[4] === "log" ? "log" : "linear",
  };
}
