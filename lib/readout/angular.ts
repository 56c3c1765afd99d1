import { evaluatePowerLaw, type PowerLaw } from "./background-fit";
import { annulusBox, columnWeight, rowFrequency, type PowerSpectrum } from "./power-spectrum";

/** Symmetry call from angular harmonics of the power on the peak ring. */
export type PatternSymmetry = "stripes" | "hexagonal" | "labyrinth";

/**
 * Angular statistics of the excess power (above the background) in rings [ringLo, ringHi].
 * hₘ = |Σ w e^{imθ}| / Σ w for m = 2, 4, 6 with θ the wave-vector angle: h₂ is the mean resultant
 * length of e^{2iθ} (axial data: Mardia & Jupp 2000, Directional Statistics, §9.3), and three
 * wave vectors 60° apart give h₂ ≈ 0 and h₆ ≈ 1.
 */
export interface AngularStats {
  /** Wave-vector direction of the strongest axis, degrees in [0, 180) from +x towards +y. */
  orientationDeg: number;
  /** For a hexagonal lattice: direction of one of the three wave vectors, degrees in [0, 60). */
  orientation6Deg: number;
  h2: number;
  h4: number;
  h6: number;
  /** Power on the ring by angle, 0 … 179 in 1° bins (θ mod 180°), for plots. */
  angularPower: Float64Array;
}

export function computeAngularStats(s: PowerSpectrum, ringLo: number, ringHi: number, bg: PowerLaw): AngularStats {
  const c = [0, 0, 0, 0, 0, 0, 0],
    sn = [0, 0, 0, 0, 0, 0, 0];
  let total = 0;
  const angularPower = new Float64Array(180);
  const { kyMax, kxMax } = annulusBox(s, ringHi);
  for (let kys = -kyMax; kys <= kyMax; kys++) {
    if (kys === s.padHeight / 2 && kys !== -kyMax) continue; // the Nyquist row is reached once, as −H/2
    const ky = (kys + s.padHeight) % s.padHeight;
    const fy = rowFrequency(ky, s.padHeight);
    for (let kx = 0; kx <= kxMax; kx++) {
      const fx = kx / s.padWidth;
      const f = Math.sqrt(fx * fx + fy * fy);
      const ring = f * s.ringN;
      if (ring < ringLo || ring > ringHi || f === 0) continue;
      const w = columnWeight(kx, s.padWidth) * Math.max(0, s.power[ky * s.halfWidth + kx] - evaluatePowerLaw(bg, f));
      if (w === 0) continue;
      const theta = Math.atan2(fy, fx);
      for (const m of [2, 4, 6]) {
        c[m] += w * Math.cos(m * theta);
        sn[m] += w * Math.sin(m * theta);
      }
      total += w;
      const deg = ((theta * 180) / Math.PI + 180) % 180;
      angularPower[Math.min(179, Math.floor(deg))] += w;
    }
  }
  const h = (m: number) => (total > 0 ? Math.hypot(c[m], sn[m]) / total : 0);
  const deg2 = (((Math.atan2(sn[2], c[2]) / 2) * 180) / Math.PI + 180) % 180;
  const deg6 = (((Math.atan2(sn[6], c[6]) / 6) * 180) / Math.PI + 60) % 60;
  return { orientationDeg: deg2, orientation6Deg: deg6, h2: h(2), h4: h(4), h6: h(6), angularPower };
}

/** Thresholds of the symmetry call (design choice, checked on synthetic patterns; no source). */
export const SYMMETRY_THRESHOLDS = { stripesH2: 0.5, hexagonalH6: 0.4 } as const;

export function classifySymmetry(a: AngularStats): PatternSymmetry {
  if (a.h2 >= SYMMETRY_THRESHOLDS.stripesH2) return "stripes";
  if (a.h6 >= SYMMETRY_THRESHOLDS.hexagonalH6) return "hexagonal";
  return "labyrinth";
}
