import seedrandom from "seedrandom";
import { failOption } from "./errors";

/**
 * Initial state: a homogeneous steady state plus uniform noise in [−amplitude, amplitude]
 * drawn from a seeded generator (seedrandom's ARC4, so the same seed gives the same bits on
 * every platform), or given fields.
 */
export type InitialState =
  | {
      kind: "steady-state-noise";
      /** Homogeneous steady state c* (one value per species). */
      steadyState: readonly number[];
      /** Absolute noise amplitude per species (or one for all). @default 1 % of |c*_s| (1e-3 where c*_s = 0) */
      noiseAmplitude?: number | readonly number[];
      /** Seed of the noise; recorded in the result. @default a random 32-bit integer */
      seed?: string | number;
    }
  | {
      kind: "fields";
      /** One value per cell for each species (row-major, like the result's fields). */
      fields: readonly ArrayLike<number>[];
      /** Optional seeded noise a_s·U(−1, 1) added on top (to perturb an earlier pattern). @default 0 */
      noiseAmplitude?: number | readonly number[];
      /** Seed of that noise; recorded in the result. @default a random 32-bit integer (only when noise is added) */
      seed?: string | number;
    };

/** Writes the initial state into `fields` and returns the seed used (null for given fields without noise). */
export function fillInitialState(state: InitialState, fields: Float64Array[]): string | null {
  const n = fields.length,
    cells = fields[0].length;
  if (state.kind === "fields") {
    if (state.fields.length !== n)
      failOption(
        "initial.fields",
        `initial.fields must have ${n} fields (one per species), got ${state.fields.length}.`,
      );
    state.fields.forEach((f, s) => {
      if (f.length !== cells)
        failOption("initial.fields", `initial.fields[${s}] must have ${cells} values (one per cell), got ${f.length}.`);
      for (let i = 0; i < cells; i++) {
        if (!Number.isFinite(f[i]))
          failOption("initial.fields", `initial.fields[${s}] has a non-finite value at cell ${i}.`);
        fields[s][i] = f[i];
      }
    });
    const a = state.noiseAmplitude;
    const amps = Array.from({ length: n }, (_, s) => (a === undefined ? 0 : typeof a === "number" ? a : a[s]));
    amps.forEach((v, s) => {
      if (!(v >= 0) || !Number.isFinite(v))
        failOption("initial.noiseAmplitude", `initial.noiseAmplitude[${s}] must be a finite number ≥ 0, got ${v}.`);
    });
    if (amps.every((v) => v === 0)) return null;
    return addNoise(fields, amps, state.seed);
  }
  const cs = state.steadyState;
  if (cs.length !== n)
    failOption("initial.steadyState", `initial.steadyState must have ${n} values (one per species), got ${cs.length}.`);
  const amps = cs.map((c, s) => {
    const a = state.noiseAmplitude;
    const v = a === undefined ? (c === 0 ? 1e-3 : 0.01 * Math.abs(c)) : typeof a === "number" ? a : a[s];
    if (!Number.isFinite(c)) failOption("initial.steadyState", `initial.steadyState[${s}] must be finite, got ${c}.`);
    if (!(v >= 0) || !Number.isFinite(v))
      failOption("initial.noiseAmplitude", `initial.noiseAmplitude[${s}] must be a finite number ≥ 0, got ${v}.`);
    return v;
  });
  for (let s = 0; s < n; s++) fields[s].fill(cs[s]);
  return addNoise(fields, amps, state.seed);
}

/** Adds a_s·U(−1, 1) from seedrandom(seed) to every cell; returns the seed as a string. */
function addNoise(fields: Float64Array[], amps: readonly number[], seedGiven: string | number | undefined): string {
  const seed = String(seedGiven ?? (Math.random() * 2 ** 32) >>> 0);
  const rng = seedrandom(seed);
  // Species-major order: all cells of species 0, then species 1, … (part of the reproducibility contract).
  for (let s = 0; s < fields.length; s++) {
    const f = fields[s],
      a = amps[s];
    for (let i = 0; i < f.length; i++) f[i] += a * (2 * rng() - 1);
  }
  return seed;
}
