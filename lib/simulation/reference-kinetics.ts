import type { ReactionSystem } from "./reaction-system";

/**
 * Schnakenberg kinetics in the textbook γ-form (Schnakenberg J. (1979) J. Theor. Biol. 81:389;
 * Murray J.D. (2003) Mathematical Biology II, ch. 2):
 *   R_u = γ(a − u + u²v),  R_v = γ(b − u²v).
 * Parameters `a`, `b`, `gamma` (uniform or per cell). Steady state u* = a + b, v* = b/(a + b)².
 * Used by the tests, the bench and as a built-in example of the interface.
 */
export const schnakenbergReaction: ReactionSystem = {
  species: 2,
  speciesNames: ["u", "v"],
  evaluate(fields, params, out, range) {
    const u = fields[0],
      v = fields[1],
      ru = out[0],
      rv = out[1];
    const start = range?.start ?? 0,
      end = range?.end ?? u.length;
    const a = params.a,
      b = params.b,
      g = params.gamma ?? 1;
    if (typeof a === "number" && typeof b === "number" && typeof g === "number") {
      for (let i = start; i < end; i++) {
        const uv = u[i] * u[i] * v[i];
        ru[i] = g * (a - u[i] + uv);
        rv[i] = g * (b - uv);
      }
      return;
    }
    for (let i = start; i < end; i++) {
      const ai = typeof a === "number" ? a : a[i];
      const bi = typeof b === "number" ? b : b[i];
      const gi = typeof g === "number" ? g : g[i];
      const uv = u[i] * u[i] * v[i];
      ru[i] = gi * (ai - u[i] + uv);
      rv[i] = gi * (bi - uv);
    }
  },
  jacobian(c, p, out) {
    const g = p.gamma ?? 1,
      u = c[0],
      v = c[1];
    out[0] = g * (-1 + 2 * u * v);
    out[1] = g * u * u;
    out[2] = g * (-2 * u * v);
    out[3] = g * (-u * u);
  },
};

/** Schnakenberg homogeneous steady state (u*, v*) = (a + b, b/(a + b)²). */
export function schnakenbergSteadyState(a: number, b: number): [number, number] {
  return [a + b, b / ((a + b) * (a + b))];
}

/** Linear decay R_s = −rate·c_s for every species (parameter `rate`, 1/s); exact reference. */
export function createLinearDecayReaction(species: number): ReactionSystem {
  return {
    species,
    evaluate(fields, params, out, range) {
      const r = params.rate ?? 0;
      const start = range?.start ?? 0,
        end = range?.end ?? fields[0].length;
      for (let s = 0; s < species; s++) {
        const c = fields[s],
          o = out[s];
        for (let i = start; i < end; i++) o[i] = -(typeof r === "number" ? r : r[i]) * c[i];
      }
    },
  };
}
