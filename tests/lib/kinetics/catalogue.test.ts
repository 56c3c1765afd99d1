import seedrandom from "seedrandom";
import { describe, expect, it } from "vitest";
import {
  CATALOGUE,
  compileKinetics,
  getCatalogueKinetics,
  resolveParameters,
  type CatalogueKinetics,
} from "@/lib/kinetics";

/** The catalogue entry rebuilt from its own expression strings through the custom compiler. */
function fromExpressions(k: CatalogueKinetics) {
  return compileKinetics({
    id: k.id,
    name: k.name,
    species: [...k.species],
    parameters: k.parameters.map((p) => ({ name: p.name, default: p.default, min: p.min, max: p.max })),
    reactions: [...k.reactionExpressions],
    diffusion: k.diffusionExpressions.map((row, i) => row[i]),
    nonNegative: k.nonNegative,
  });
}

describe("catalogue", () => {
  it("has stable, unique kebab-case ids and the nine published kinetics", () => {
    const ids = CATALOGUE.map((k) => k.id);
    expect(new Set(ids).size).toBe(ids.length);
    ids.forEach((id) => expect(id).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/));
    expect(ids).toEqual([
      "schnakenberg",
      "gierer-meinhardt",
      "gierer-meinhardt-saturation",
      "brusselator",
      "lengyel-epstein",
      "fitzhugh-nagumo",
      "thomas",
      "gray-scott",
      "brusselator-three-species",
    ]);
    CATALOGUE.forEach((k) => {
      expect(k.source.length).toBeGreaterThan(10);
      k.parameters.forEach((p) => expect(p.default >= p.min && p.default <= p.max).toBe(true));
    });
  });

  // Round-trip invariant: hand-written rates/Jacobian == mathjs expressions + symbolic derivative.
  it.each(CATALOGUE.map((k) => [k.id, k] as const))(
    "%s: compiled JS agrees with its expression strings to 1e-9",
    (_id, k) => {
      const custom = fromExpressions(k);
      expect(custom.jacobianMethod).toBe("symbolic");
      const n = k.species.length,
        rng = seedrandom(k.id);
      const p = resolveParameters(k);
      const a = new Float64Array(n * n),
        b = new Float64Array(n * n),
        ra = new Float64Array(n),
        rb = new Float64Array(n);
      for (let trial = 0; trial < 20; trial++) {
        const c = Array.from({ length: n }, () => 0.05 + 3 * rng());
        k.rates(c, p, ra);
        custom.rates(c, p, rb);
        k.jacobian(c, p, a);
        custom.jacobian(c, p, b);
        for (let i = 0; i < n; i++) expect(ra[i]).toBeWithinScaled(rb[i], 1e-9);
        for (let i = 0; i < n * n; i++) expect(a[i]).toBeWithinScaled(b[i], 1e-9);
      }
      const da = new Float64Array(n * n),
        db = new Float64Array(n * n);
      k.diffusion(p, da);
      custom.diffusion(p, db);
      expect(Array.from(db)).toEqual(Array.from(da));
    },
  );

  // Closed-form steady states must be roots of the reaction terms (definition of a steady state).
  it.each(CATALOGUE.map((k) => [k.id, k] as const))("%s: closed-form steady states satisfy R(c*) = 0", (_id, k) => {
    const n = k.species.length,
      p = resolveParameters(k);
    const buf = new Float64Array(8 * n),
      r = new Float64Array(n);
    const m = k.steadyStates!(p, buf);
    expect(m).toBeGreaterThan(0);
    for (let s = 0; s < m; s++) {
      const c = buf.subarray(s * n, s * n + n);
      k.rates(c, p, r);
      const scale = 1 + Math.max(...Array.from(c, Math.abs));
      r.forEach((x) => expect(Math.abs(x)).toBeLessThan(1e-10 * scale));
    }
  });

  it("Gray–Scott lists both non-trivial states and the trivial state (1, 0) (Pearson 1993)", () => {
    const k = getCatalogueKinetics("gray-scott");
    const buf = new Float64Array(16);
    const m = k.steadyStates!(resolveParameters(k, { F: 0.04, k: 0.05 }), buf);
    expect(m).toBe(3);
    expect([buf[4], buf[5]]).toEqual([1, 0]);
    // Beyond the saddle-node F < 4(F + k)² only the trivial state remains.
    expect(k.steadyStates!(resolveParameters(k, { F: 0.01, k: 0.1 }), buf)).toBe(1);
  });

  it("Thomas: the positive root obeys a − u* = α(b − v*) (difference of the two equations, algebra)", () => {
    const k = getCatalogueKinetics("thomas");
    const buf = new Float64Array(16);
    expect(k.steadyStates!(resolveParameters(k), buf)).toBe(1);
    expect(150 - buf[0]).toBeCloseTo(1.5 * (100 - buf[1]), 10);
  });
});
