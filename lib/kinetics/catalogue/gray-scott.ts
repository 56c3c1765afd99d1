import { defineCatalogueKinetics, param } from "./define";

/** p = [F, k, Du, Dv] */
export const grayScott = defineCatalogueKinetics({
  id: "gray-scott",
  name: "Gray–Scott",
  source: "Gray P. & Scott S.K. (1984) Chem. Eng. Sci. 39:1087–1097; form of Pearson J.E. (1993) Science 261:189–192",
  form: "u_t = −uv² + F(1 − u) + Du∇²u, v_t = uv² − (F + k)v + Dv∇²v",
  species: ["u", "v"],
  parameters: [
    param("F", "feed rate (default near the saddle-node line, where the linear Turing band lies)", 0.055, 0, 1),
    param("k", "removal rate of v", 0.0618, 0, 1),
    param("Du", "diffusivity of u", 2e-5, 1e-12, 1e6),
    param("Dv", "diffusivity of v", 1e-5, 1e-12, 1e6),
  ],
  reactions: ["-u * v^2 + F * (1 - u)", "u * v^2 - (F + k) * v"],
  diffusion: ["Du", "Dv"],
  rates(c, p, out) {
    const u = c[0],
      v = c[1],
      uvv = u * v * v;
    out[0] = -uvv + p[0] * (1 - u);
    out[1] = uvv - (p[0] + p[1]) * v;
  },
  jacobian(c, p, out) {
    const u = c[0],
      v = c[1];
    out[0] = -v * v - p[0];
    out[1] = -2 * u * v;
    out[2] = v * v;
    out[3] = 2 * u * v - (p[0] + p[1]);
  },
  diffusionValues(p, out) {
    out[0] = p[2];
    out[1] = 0;
    out[2] = 0;
    out[3] = p[3];
  },
  // Nontrivial states: uv = F + k, (F + k)v² − Fv + F(F + k) = 0; u = 1 − (F + k)v/F.
  // Listed first (upper branch, lower branch), then the trivial state (1, 0).
  steadyStates(p, out) {
    const F = p[0],
      s = p[0] + p[1];
    let m = 0;
    const disc = F * F - 4 * F * s * s;
    if (F > 0 && s > 0 && disc >= 0) {
      const r = Math.sqrt(disc);
      const vUpper = (F + r) / (2 * s);
      out[0] = 1 - (s * vUpper) / F;
      out[1] = vUpper;
      m = 1;
      if (disc > 0) {
        const vLower = (F - r) / (2 * s);
        out[2] = 1 - (s * vLower) / F;
        out[3] = vLower;
        m = 2;
      }
    }
    out[2 * m] = 1;
    out[2 * m + 1] = 0;
    return m + 1;
  },
  steadyStateForm: "explicit",
});
