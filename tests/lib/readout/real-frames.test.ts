/**
 * Frames as microscopes give them, with the wavelength exact by construction
 * (lib/synthetic/make-microscope-frame.ts): uneven illumination up to 10× the pattern's
 * amplitude (vignetting, ramps; added or multiplying), blur by the point-spread function and
 * camera noise. The default readout must give the right wavelength (within 2 %) and symmetry,
 * or "no significant period" on frames without a pattern — never a background slope as a period.
 * (Tolerances: the acceptance figures; common practice, no source.)
 */
import { describe, expect, it } from "vitest";
import { readWavelength } from "@/lib/readout";
import { makeMicroscopeFrame, type MicroscopeFrameOptions } from "@/lib/synthetic";

const SIZE = { width: 384, height: 320 };

type Case = Omit<MicroscopeFrameOptions, "width" | "height">;
const patterned: Case[] = [
  { pattern: "stripes", wavelengthPx: 12, angleDeg: 20, vignetting: 3, noise: 0.3, seed: 1 },
  { pattern: "stripes", wavelengthPx: 20, angleDeg: 75, vignetting: 10, gradient: 5, noise: 0.3, seed: 2 },
  {
    pattern: "stripes",
    wavelengthPx: 16,
    angleDeg: 0,
    vignetting: 10,
    multiplicative: true,
    noise: 0.2,
    blurSigmaPx: 2,
    seed: 3,
  },
  {
    pattern: "stripes",
    wavelengthPx: 24,
    angleDeg: 130,
    gradient: 10,
    multiplicative: true,
    noise: 0.5,
    blurSigmaPx: 3,
    seed: 4,
  },
  { pattern: "spots", wavelengthPx: 16, angleDeg: 10, vignetting: 3, noise: 0.3, seed: 5 },
  {
    pattern: "spots",
    wavelengthPx: 24,
    angleDeg: 40,
    vignetting: 10,
    gradient: 5,
    noise: 0.3,
    blurSigmaPx: 1.5,
    seed: 6,
  },
  {
    pattern: "spots",
    wavelengthPx: 14,
    angleDeg: 0,
    vignetting: 6,
    multiplicative: true,
    noise: 0.2,
    blurSigmaPx: 1,
    seed: 7,
  },
  {
    pattern: "spots",
    wavelengthPx: 30,
    angleDeg: 25,
    vignetting: 10,
    gradient: -8,
    multiplicative: true,
    noise: 0.4,
    blurSigmaPx: 3,
    seed: 8,
  },
];
const backgroundOnly: Case[] = [
  { pattern: "none", vignetting: 3, noise: 0.05, seed: 11 },
  { pattern: "none", vignetting: 10, gradient: 5, noise: 0.3, seed: 12 },
  { pattern: "none", vignetting: 10, noise: 0.3, blurSigmaPx: 1, seed: 13 },
  { pattern: "none", vignetting: 3, gradient: 8, noise: 0.05, blurSigmaPx: 3, seed: 14 },
  { pattern: "none", vignetting: 10, multiplicative: true, noise: 1, blurSigmaPx: 0.7, seed: 15 },
  { pattern: "none", gradient: 10, noise: 0.2, seed: 16 },
];

describe("frames with uneven illumination, blur and noise", () => {
  it.each(
    patterned.map(
      (c) =>
        [
          `${c.pattern} λ = ${c.wavelengthPx} px, vignetting ${c.vignetting ?? 0}×, ramp ${c.gradient ?? 0}×${c.multiplicative ? " (multiplying)" : ""}, blur ${c.blurSigmaPx ?? 0} px`,
          c,
        ] as const,
    ),
  )("%s: λ within 2 %, right symmetry", (_, c) => {
    const r = readWavelength(makeMicroscopeFrame({ ...SIZE, ...c }), { pixelSizeUm: 1 });
    expect(r.periodFound).toBe(true);
    expect(Math.abs(r.wavelengthPx! / c.wavelengthPx! - 1)).toBeLessThan(0.02);
    expect(r.symmetry).toBe(c.pattern === "spots" ? "hexagonal" : "stripes");
  });

  it.each(
    backgroundOnly.map(
      (c) =>
        [
          `vignetting ${c.vignetting ?? 0}×, ramp ${c.gradient ?? 0}×, noise ${c.noise}, blur ${c.blurSigmaPx ?? 0} px`,
          c,
        ] as const,
    ),
  )("background only, %s: no significant period", (_, c) => {
    const r = readWavelength(makeMicroscopeFrame({ ...SIZE, ...c }), { pixelSizeUm: 1 });
    expect(r.periodFound).toBe(false);
    expect(r.wavelengthUm).toBeNull();
    expect(r.significance).toBeLessThan(r.significanceThreshold);
  });
});
