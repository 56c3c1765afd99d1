import seedrandom from "seedrandom";

/** A seeded uniform generator on [0, 1) plus a standard-normal draw (Box–Muller). */
export interface Rng {
  uniform(): number;
  normal(): number;
}

/** Seeded generator; the same seed gives the same sequence on every platform (seedrandom ARC4). */
export function createRng(seed: string | number): Rng {
  const prng = seedrandom(String(seed));
  let spare: number | null = null;
  return {
    uniform: () => prng(),
    normal: () => {
      if (spare !== null) {
        const s = spare;
        spare = null;
        return s;
      }
      // Box–Muller transform (Box & Muller 1958, Ann. Math. Stat. 29:610).
      let u = 0;
      while (u === 0) u = prng();
      const v = prng();
      const r = Math.sqrt(-2 * Math.log(u));
      spare = r * Math.sin(2 * Math.PI * v);
      return r * Math.cos(2 * Math.PI * v);
    },
  };
}
