/**
 * Admissible wavenumbers of bounded domains with zero-flux boundaries (SCIENCE.md §2):
 * interval k_n = nπ/L; rectangle k² = (mπ/Lx)² + (nπ/Ly)²; sphere k² = l(l+1)/R² with
 * multiplicity 2l + 1 (Laplace–Beltrami eigenvalues).
 */
import { KineticsInputError, KineticsLimitError } from "../kinetics/errors";

/** Domain sizes; `units` says whether they are µm (needs a length scale) or model units. */
export type DomainSpec =
  | { kind: "interval"; length: number; units?: "um" | "model" }
  | { kind: "rectangle"; lx: number; ly: number; units?: "um" | "model" }
  | { kind: "sphere"; radius: number; units?: "um" | "model" };

/** Most admissible modes enumerated below k_max. */
export const MAX_ADMISSIBLE_MODES = 200_000;

export interface AdmissibleMode {
  /** Mode indices: [n] interval, [m, n] rectangle, [l] sphere. */
  indices: number[];
  /** Wavenumber, model units⁻¹. */
  k: number;
  /** Number of independent eigenfunctions with this k (2l + 1 on a sphere, else 1). */
  multiplicity: number;
}

/** The domain in model units, validated. `lengthScaleUm` converts µm sizes. */
export function toModelDomain(domain: DomainSpec, lengthScaleUm: number | null): DomainSpec {
  const units = domain.units ?? (lengthScaleUm === null ? "model" : "um");
  if (units === "um" && lengthScaleUm === null) {
    throw new KineticsInputError(
      "domain.units",
      'Domain sizes in µm need a length scale (lengthScaleUm) for a non-dimensional kinetics; give one or use units "model".',
    );
  }
  const f = units === "um" ? 1 / (lengthScaleUm as number) : 1;
  const size = (field: string, v: unknown) => {
    if (typeof v !== "number" || !Number.isFinite(v) || v <= 0)
      throw new KineticsInputError(
        `domain.${field}`,
        `domain.${field} must be a positive finite number (got ${String(v)}).`,
      );
    return v * f;
  };
  switch (domain.kind) {
    case "interval":
      return { kind: "interval", length: size("length", domain.length), units: "model" };
    case "rectangle":
      return { kind: "rectangle", lx: size("lx", domain.lx), ly: size("ly", domain.ly), units: "model" };
    case "sphere":
      return { kind: "sphere", radius: size("radius", domain.radius), units: "model" };
    default:
      throw new KineticsInputError("domain.kind", `domain.kind must be "interval", "rectangle" or "sphere".`);
  }
}

/** Modes with 0 < k ≤ kMax of a model-unit domain (the k = 0 mode is excluded). */
export function enumerateModes(domain: DomainSpec, kMax: number): AdmissibleMode[] {
  const modes: AdmissibleMode[] = [];
  const push = (m: AdmissibleMode) => {
    if (modes.length >= MAX_ADMISSIBLE_MODES) {
      throw new KineticsLimitError(
        "domain",
        `The domain has more than ${MAX_ADMISSIBLE_MODES} admissible modes in the unstable range; it is effectively unbounded, use the unbounded result.`,
      );
    }
    modes.push(m);
  };
  if (domain.kind === "interval") {
    const nMax = Math.floor((kMax * domain.length) / Math.PI);
    for (let n = 1; n <= Math.max(1, nMax); n++)
      push({ indices: [n], k: (n * Math.PI) / domain.length, multiplicity: 1 });
  } else if (domain.kind === "rectangle") {
    const mMax = Math.max(1, Math.floor((kMax * domain.lx) / Math.PI)),
      nMax = Math.max(1, Math.floor((kMax * domain.ly) / Math.PI));
    for (let m = 0; m <= mMax; m++) {
      for (let n = 0; n <= nMax; n++) {
        if (m === 0 && n === 0) continue;
        const k = Math.hypot((m * Math.PI) / domain.lx, (n * Math.PI) / domain.ly);
        if (k <= kMax || m + n === 1) push({ indices: [m, n], k, multiplicity: 1 });
      }
    }
  } else {
    const R = domain.radius;
    for (let l = 1; ; l++) {
      const k = Math.sqrt(l * (l + 1)) / R;
      if (k > kMax && l > 1) break;
      push({ indices: [l], k, multiplicity: 2 * l + 1 });
    }
  }
  return modes;
}

/** How many repeats mode `m` lays across the domain (SCIENCE.md §2). */
export function describeRepeats(domain: DomainSpec, m: AdmissibleMode): Record<string, number> {
  if (domain.kind === "interval") {
    const n = m.indices[0];
    return { wavelengthsAcross: n / 2, maxima: Math.floor(n / 2) + 1 };
  }
  if (domain.kind === "rectangle") {
    const [a, b] = m.indices;
    return {
      wavelengthsAcrossX: a / 2,
      wavelengthsAcrossY: b / 2,
      maxima: (Math.floor(a / 2) + 1) * (Math.floor(b / 2) + 1),
    };
  }
  // On a sphere, Y_l^m has l nodal lines; Y_l^l has l wavelengths around the equator.
  return { degree: m.indices[0], multiplicity: m.multiplicity, wavelengthsAroundGreatCircle: m.indices[0] };
}
