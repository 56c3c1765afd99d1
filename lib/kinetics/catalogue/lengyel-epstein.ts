import { defineCatalogueKinetics, param } from "./define";

/** p = [a, b, sigma, d] */
export const lengyelEpstein = defineCatalogueKinetics({
  id: "lengyel-epstein",
  name: "Lengyel–Epstein (CIMA reaction)",
  source: "Lengyel I. & Epstein I.R. (1991) Science 251:650–652",
  form: "u_t = a − u − 4uv/(1 + u²) + ∇²u, v_t = σ[b(u − uv/(1 + u²)) + d∇²v]",
  species: ["u", "v"],
  parameters: [
    param("a", "feed parameter", 12, 1e-6, 1000),
    param("b", "feed parameter of v", 0.2, 1e-6, 1000),
    param("sigma", "slow-down of v by the complexing agent (σ)", 50, 1e-6, 1e6),
    param("d", "diffusivity ratio D_v/D_u", 1, 1e-6, 1e6),
  ],
  reactions: ["a - u - 4 * u * v / (1 + u^2)", "sigma * b * (u - u * v / (1 + u^2))"],
  diffusion: ["1", "sigma * d"],
  rates(c, p, out) {
    const u = c[0],
      v = c[1],
      s = 1 + u * u;
    out[0] = p[0] - u - (4 * u * v) / s;
    out[1] = p[2] * p[1] * (u - (u * v) / s);
  },
  jacobian(c, p, out) {
    const u = c[0],
      v = c[1],
      s = 1 + u * u,
      sb = p[2] * p[1];
    const dq = (1 - u * u) / (s * s); // d/du [u/(1+u²)]
    out[0] = -1 - 4 * v * dq;
    out[1] = (-4 * u) / s;
    out[2] = sb * (1 - v * dq);
    out[3] = (-sb * u) / s;
  },
  diffusionValues(p, out) {
    out[0] = 1;
    out[1] = 0;
    out[2] = 0;
    out[3] = p[2] * p[3];
  },
  // u* = a/5, v* = 1 + u*² (Lengyel & Epstein 1991).
  steadyStates(p, out) {
    const u = p[0] / 5;
    out[0] = u;
    out[1] = 1 + u * u;
    return 1;
  },
  steadyStateForm: "explicit",
});
