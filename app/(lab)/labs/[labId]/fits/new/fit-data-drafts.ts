/** What the fit builder's data section holds while the user edits it, before it becomes a request. */

export const field =
  "w-full rounded-md border border-rule bg-card px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none";

/** A readout offered for the fit: whether it is used, under which condition, read as which kind. */
export interface Pick {
  on: boolean;
  condition: string;
  kind: "fourier" | "nearest-neighbour";
}
/** A measurement typed by hand. */
export interface Typed {
  condition: string;
  kind: "fourier" | "nearest-neighbour";
  wavelengthUm: string;
  uncertaintyUm: string;
}
/** The optional tissue size of one condition. */
export interface Tissue {
  kind: "none" | "interval" | "rectangle";
  a: string;
  b: string;
}

/** The distinct, non-blank conditions of the ticked readouts and typed measurements, in order of first use. */
export function listConditions(picks: Record<string, Pick>, typed: Typed[]): string[] {
  return [
    ...new Set(
      [
        ...Object.values(picks)
          .filter((p) => p.on)
          .map((p) => p.condition.trim()),
        ...typed.map((t) => t.condition.trim()),
      ].filter(Boolean),
    ),
  ];
}
