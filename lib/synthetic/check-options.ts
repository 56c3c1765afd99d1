import { CoreError } from "../errors/core-error";

/** The one reason a synthetic generator refuses: an option out of range (the app answers 400). */
export const SYNTHETIC_ERROR_CODES = ["bad_option"] as const;
export type SyntheticErrorCode = (typeof SYNTHETIC_ERROR_CODES)[number];

/** An invalid option of a synthetic generator; `field` names the option. */
export class SyntheticOptionError extends CoreError<SyntheticErrorCode> {
  readonly family = "synthetic";
  declare readonly field: string;
  constructor(field: string, message: string) {
    super("bad_option", message, field);
    this.name = "SyntheticOptionError";
  }
}

/** Largest synthetic image side (px): keeps a generator call under ~1 GiB of Float32 data. */
export const MAX_SYNTHETIC_SIDE_PX = 16384;

export function checkSize(width: number, height: number): void {
  for (const [field, v] of [
    ["width", width],
    ["height", height],
  ] as const) {
    if (!Number.isInteger(v) || v < 1 || v > MAX_SYNTHETIC_SIDE_PX) {
      throw new SyntheticOptionError(
        field,
        `${field} must be an integer from 1 to ${MAX_SYNTHETIC_SIDE_PX} px (got ${v}).`,
      );
    }
  }
}

export function checkPositive(field: string, v: number, min = 0): void {
  if (!Number.isFinite(v) || v <= min) {
    throw new SyntheticOptionError(field, `${field} must be a finite number above ${min} (got ${v}).`);
  }
}

export function checkAtLeast(field: string, v: number, min: number): void {
  if (!Number.isFinite(v) || v < min) {
    throw new SyntheticOptionError(field, `${field} must be a finite number of at least ${min} (got ${v}).`);
  }
}

export function checkRange(field: string, v: number, lo: number, hi: number): void {
  if (!Number.isFinite(v) || v < lo || v > hi) {
    throw new SyntheticOptionError(field, `${field} must be from ${lo} to ${hi} (got ${v}).`);
  }
}

/** Adds Gaussian noise of SD `noise` (if > 0) and clamps every value into 0..1. */
export function addNoiseAndClamp(data: Float32Array, noise: number, normal: () => number): void {
  for (let i = 0; i < data.length; i++) {
    let v = data[i] + (noise > 0 ? noise * normal() : 0);
    if (v < 0) v = 0;
    else if (v > 1) v = 1;
    data[i] = v;
  }
}
