import { solveCubicReal } from "../cubic";
import { defineCatalogueKinetics, GAMMA, param, writeUnitAndRatio } from "./define";

const SOURCE =
  "Gierer A. & Meinhardt H. (1972) Kybernetik 12:30–39; non-dimensional form of Murray J.D. (2003) Mathematical Biology II, 3rd ed., Springer, §2.3";

/** p = [gamma, a, b, d] */
export const giererMeinhardt = defineCatalogueKinetics({
  id: "gierer-meinhardt",
  name: "Gierer–Meinhardt (activator–inhibitor)",
  source: SOURCE,
  form: "u_t = γ(a − bu + u²/v) + ∇²u, v_t = γ(u² − v) + d∇²v",
  species: ["u", "v"],
  parameters: [
    GAMMA,
    param("a", "basal activator production", 0.1, 0, 100),
    param("b", "activator decay rate", 1, 1e-6, 100),
    param("d", "diffusivity ratio D_v/D_u", 30, 1e-6, 1e6),
  ],
  reactions: ["gamma * (a - b * u + u^2 / v)", "gamma * (u^2 - v)"],
  diffusion: ["1", "d"],
  rates(c, p, out) {
    const u = c[0],
      v = c[1],
      g = p[0];
    out[0] = g * (p[1] - p[2] * u + (u * u) / v);
    out[1] = g * (u * u - v);
  },
  jacobian(c, p, out) {
    const u = c[0],
      v = c[1],
      g = p[0];
    out[0] = g * (-p[2] + (2 * u) / v);
    out[1] = g * (-(u * u) / (v * v));
    out[2] = g * 2 * u;
    out[3] = -g;
  },
  diffusionValues(p, out) {
    writeUnitAndRatio(p[3], out);
  },
  // u* = (a + 1)/b, v* = u*² (Murray 2003 §2.3).
  steadyStates(p, out) {
    const u = (p[1] + 1) / p[2];
    out[0] = u;
    out[1] = u * u;
    return 1;
  },
  steadyStateForm: "explicit",
});

const roots = new Float64Array(3);

/** p = [gamma, a, b, K, d] */
export const giererMeinhardtSaturation = defineCatalogueKinetics({
  id: "gierer-meinhardt-saturation",
  name: "Gierer–Meinhardt with activator saturation",
  source: `${SOURCE}; saturation term as in Murray (2003) §2.3`,
  form: "u_t = γ(a − bu + u²/(v(1 + Ku²))) + ∇²u, v_t = γ(u² − v) + d∇²v",
  species: ["u", "v"],
  parameters: [
    GAMMA,
    param("a", "basal activator production", 0.1, 0, 100),
    param("b", "activator decay rate", 1, 1e-6, 100),
    param("K", "activator saturation constant", 0.1, 0, 1e3),
    param("d", "diffusivity ratio D_v/D_u", 30, 1e-6, 1e6),
  ],
  reactions: ["gamma * (a - b * u + u^2 / (v * (1 + K * u^2)))", "gamma * (u^2 - v)"],
  diffusion: ["1", "d"],
  rates(c, p, out) {
    const u = c[0],
      v = c[1],
      g = p[0];
    out[0] = g * (p[1] - p[2] * u + (u * u) / (v * (1 + p[3] * u * u)));
    out[1] = g * (u * u - v);
  },
  jacobian(c, p, out) {
    const u = c[0],
      v = c[1],
      g = p[0],
      s = 1 + p[3] * u * u;
    out[0] = g * (-p[2] + (2 * u) / (v * s * s));
    out[1] = g * (-(u * u) / (v * v * s));
    out[2] = g * 2 * u;
    out[3] = -g;
  },
  diffusionValues(p, out) {
    writeUnitAndRatio(p[4], out);
  },
  // v = u², then (a − bu)(1 + Ku²) + 1 = 0: −bK u³ + aK u² − b u + (a + 1) = 0, one positive root.
  steadyStates(p, out) {
    const a = p[1],
      b = p[2],
      K = p[3];
    const n = solveCubicReal(-b * K, a * K, -b, a + 1, roots);
    let m = 0;
    for (let i = 0; i < n; i++) {
      const u = roots[i];
      if (u > 0) {
        out[2 * m] = u;
        out[2 * m + 1] = u * u;
        m++;
      }
    }
    return m;
  },
  steadyStateForm: "polynomial-roots",
});
