import { solveCubicReal } from "../cubic";
import { defineCatalogueKinetics, GAMMA, param, writeUnitAndRatio } from "./define";

const roots = new Float64Array(3);

/** p = [gamma, a, b, alpha, rho, K, d] */
export const thomas = defineCatalogueKinetics({
  id: "thomas",
  name: "Thomas (substrate inhibition)",
  source:
    "Thomas D. (1975) in Analysis and Control of Immobilized Enzyme Systems (Thomas D. & Kernevez J.-P., eds), North-Holland, 115–150; non-dimensional form of Murray J.D. (2003) Mathematical Biology II, 3rd ed., Springer, §2.3",
  form: "u_t = γ(a − u − ρuv/(1 + u + Ku²)) + ∇²u, v_t = γ(α(b − v) − ρuv/(1 + u + Ku²)) + d∇²v",
  species: ["u", "v"],
  parameters: [
    GAMMA,
    param("a", "supply of u", 150, 0, 1e4),
    param("b", "supply of v", 100, 0, 1e4),
    param("alpha", "relative supply rate α of v", 1.5, 1e-6, 1e3),
    param("rho", "reaction rate ρ", 13, 0, 1e4),
    param("K", "substrate-inhibition constant", 0.05, 0, 1e3),
    param("d", "diffusivity ratio D_v/D_u", 30, 1e-6, 1e6),
  ],
  reactions: [
    "gamma * (a - u - rho * u * v / (1 + u + K * u^2))",
    "gamma * (alpha * (b - v) - rho * u * v / (1 + u + K * u^2))",
  ],
  diffusion: ["1", "d"],
  rates(c, p, out) {
    const u = c[0],
      v = c[1],
      g = p[0];
    const h = (p[4] * u * v) / (1 + u + p[5] * u * u);
    out[0] = g * (p[1] - u - h);
    out[1] = g * (p[3] * (p[2] - v) - h);
  },
  jacobian(c, p, out) {
    const u = c[0],
      v = c[1],
      g = p[0],
      rho = p[4],
      K = p[5];
    const den = 1 + u + K * u * u;
    const hu = (rho * v * (1 - K * u * u)) / (den * den);
    const hv = (rho * u) / den;
    out[0] = g * (-1 - hu);
    out[1] = g * -hv;
    out[2] = g * -hu;
    out[3] = g * (-p[3] - hv);
  },
  diffusionValues(p, out) {
    writeUnitAndRatio(p[6], out);
  },
  // v = b − (a − u)/α, then −K u³ + (aK − 1 − ρ/α) u² + (a − 1 − ρb + ρa/α) u + a = 0.
  steadyStates(p, out) {
    const a = p[1],
      b = p[2],
      al = p[3],
      rho = p[4],
      K = p[5];
    const n = solveCubicReal(-K, a * K - 1 - rho / al, a - 1 - rho * b + (rho * a) / al, a, roots);
    let m = 0;
    for (let i = 0; i < n; i++) {
      const u = roots[i];
      const v = b - (a - u) / al;
      if (u >= 0 && v >= 0) {
        out[2 * m] = u;
        out[2 * m + 1] = v;
        m++;
      }
    }
    return m;
  },
  steadyStateForm: "polynomial-roots",
});
