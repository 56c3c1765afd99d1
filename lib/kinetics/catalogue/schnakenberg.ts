import { defineCatalogueKinetics, GAMMA, param, writeUnitAndRatio } from "./define";

/** p = [gamma, a, b, d] */
export const schnakenberg = defineCatalogueKinetics({
  id: "schnakenberg",
  name: "Schnakenberg",
  source:
    "Schnakenberg J. (1979) J. Theor. Biol. 81:389–400; non-dimensional form of Murray J.D. (2003) Mathematical Biology II, 3rd ed., Springer, §2.3–2.4",
  form: "u_t = γ(a − u + u²v) + ∇²u, v_t = γ(b − u²v) + d∇²v",
  species: ["u", "v"],
  parameters: [
    GAMMA,
    param("a", "production rate of u", 0.1, 0, 100),
    param("b", "production rate of v", 0.9, 0, 100),
    param("d", "diffusivity ratio D_v/D_u", 20, 1e-6, 1e6),
  ],
  reactions: ["gamma * (a - u + u^2 * v)", "gamma * (b - u^2 * v)"],
  diffusion: ["1", "d"],
  rates(c, p, out) {
    const u = c[0],
      v = c[1],
      g = p[0];
    out[0] = g * (p[1] - u + u * u * v);
    out[1] = g * (p[2] - u * u * v);
  },
  jacobian(c, p, out) {
    const u = c[0],
      v = c[1],
      g = p[0];
    out[0] = g * (-1 + 2 * u * v);
    out[1] = g * u * u;
    out[2] = g * -2 * u * v;
    out[3] = g * -u * u;
  },
  diffusionValues(p, out) {
    writeUnitAndRatio(p[3], out);
  },
  // u* = a + b, v* = b/(a + b)² (Murray 2003 eq. 2.39).
  steadyStates(p, out) {
    const s = p[1] + p[2];
    if (!(s > 0)) return 0;
    out[0] = s;
    out[1] = p[2] / (s * s);
    return 1;
  },
  steadyStateForm: "explicit",
});
