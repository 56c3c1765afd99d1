import { solveCubicReal } from "../cubic";
import { defineCatalogueKinetics, GAMMA, param, writeUnitAndRatio } from "./define";

const roots = new Float64Array(3);

/** p = [gamma, eps, a, b, d] */
export const fitzhughNagumo = defineCatalogueKinetics({
  id: "fitzhugh-nagumo",
  name: "FitzHugh–Nagumo type (linear–cubic)",
  source:
    "FitzHugh R. (1961) Biophys. J. 1:445–466; Nagumo J., Arimoto S. & Yoshizawa S. (1962) Proc. IRE 50:2061–2070; with diffusion of both species (activator–inhibitor form)",
  form: "u_t = γ(u − u³/3 − v) + ∇²u, v_t = γε(u + a − bv) + d∇²v",
  species: ["u", "v"],
  parameters: [
    GAMMA,
    param("eps", "time-scale ratio ε of the recovery variable", 3, 1e-6, 1e4),
    param("a", "offset of the v-nullcline", 0, -100, 100),
    param("b", "slope parameter of the v-nullcline", 0.5, 1e-6, 100),
    param("d", "diffusivity ratio D_v/D_u", 20, 1e-6, 1e6),
  ],
  reactions: ["gamma * (u - u^3 / 3 - v)", "gamma * eps * (u + a - b * v)"],
  diffusion: ["1", "d"],
  rates(c, p, out) {
    const u = c[0],
      v = c[1],
      g = p[0];
    out[0] = g * (u - (u * u * u) / 3 - v);
    out[1] = g * p[1] * (u + p[2] - p[3] * v);
  },
  jacobian(c, p, out) {
    const u = c[0],
      g = p[0];
    out[0] = g * (1 - u * u);
    out[1] = -g;
    out[2] = g * p[1];
    out[3] = -g * p[1] * p[3];
  },
  diffusionValues(p, out) {
    writeUnitAndRatio(p[4], out);
  },
  // v = (u + a)/b on the v-nullcline, so b u³ + 3(1 − b) u + 3a = 0 (one or three real roots).
  steadyStates(p, out) {
    const a = p[2],
      b = p[3];
    const n = solveCubicReal(b, 0, 3 * (1 - b), 3 * a, roots);
    for (let i = 0; i < n; i++) {
      out[2 * i] = roots[i];
      out[2 * i + 1] = (roots[i] + a) / b;
    }
    return n;
  },
  steadyStateForm: "polynomial-roots",
  nonNegative: false,
});
