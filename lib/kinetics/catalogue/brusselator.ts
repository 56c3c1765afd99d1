import { defineCatalogueKinetics, param } from "./define";

/** p = [a, b, Du, Dv] */
export const brusselator = defineCatalogueKinetics({
  id: "brusselator",
  name: "Brusselator",
  source: "Prigogine I. & Lefever R. (1968) J. Chem. Phys. 48:1695–1700",
  form: "u_t = a − (b + 1)u + u²v + Du∇²u, v_t = bu − u²v + Dv∇²v",
  species: ["u", "v"],
  parameters: [
    param("a", "feed of u", 1.5, 1e-6, 100),
    param("b", "conversion rate u → v", 2.5, 0, 1000),
    param("Du", "diffusivity of u", 1, 1e-9, 1e9),
    param("Dv", "diffusivity of v", 10, 1e-9, 1e9),
  ],
  reactions: ["a - (b + 1) * u + u^2 * v", "b * u - u^2 * v"],
  diffusion: ["Du", "Dv"],
  rates(c, p, out) {
    const u = c[0],
      v = c[1],
      a = p[0],
      b = p[1];
    out[0] = a - (b + 1) * u + u * u * v;
    out[1] = b * u - u * u * v;
  },
  jacobian(c, p, out) {
    const u = c[0],
      v = c[1],
      b = p[1];
    out[0] = -(b + 1) + 2 * u * v;
    out[1] = u * u;
    out[2] = b - 2 * u * v;
    out[3] = -u * u;
  },
  diffusionValues(p, out) {
    out[0] = p[2];
    out[1] = 0;
    out[2] = 0;
    out[3] = p[3];
  },
  // (u*, v*) = (a, b/a) (Prigogine & Lefever 1968).
  steadyStates(p, out) {
    out[0] = p[0];
    out[1] = p[1] / p[0];
    return 1;
  },
  steadyStateForm: "explicit",
});
