/**
 * A field path as the API and the science core write it — `models[1].lengthScaleUm`,
 * `models.1.lengthScaleUm`, `["models", 1, "lengthScaleUm"]` — read into one list of segments,
 * and counted positions said as a person says them ("second", "line 3"). Pure: used by the
 * field labels, the route glue and the forms.
 */

export type PathSegment = string | number;

/** `a.b[0].c`, `a.b.0.c` or a segment list → `["a", "b", 0, "c"]` (digits become numbers). */
export function splitFieldPath(path: string | readonly PropertyKey[]): PathSegment[] {
  const raw: PropertyKey[] = typeof path === "string" ? path.split(/[.[\]]+/).filter((s) => s !== "") : [...path];
  return raw.map((s) => (typeof s === "number" ? s : /^\d+$/.test(String(s)) ? Number(s) : String(s)));
}

const ORDINALS = ["first", "second", "third", "fourth", "fifth", "sixth", "seventh", "eighth", "ninth", "tenth"];

/** 0 → "first", 1 → "second", … 10 → "11th": a position counted from 1, as a person counts. */
export function ordinal(index: number): string {
  if (index < ORDINALS.length) return ORDINALS[index];
  const n = index + 1;
  const tens = n % 100;
  const suffix = tens >= 11 && tens <= 13 ? "th" : ({ 1: "st", 2: "nd", 3: "rd" } as Record<number, string>)[n % 10];
  return `${n}${suffix ?? "th"}`;
}
