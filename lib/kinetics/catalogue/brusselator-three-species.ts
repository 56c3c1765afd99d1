import { defineCatalogueKinetics, param } from "./define";

/** p = [a, b, c, d, Dx, Dy, Dz] */
export const brusselatorThreeSpecies = defineCatalogueKinetics({
  id: "brusselator-three-species",
  name: "Brusselator coupled to a third species",
  source: "Yang L., Dolnik M., Zhabotinsky A.M. & Epstein I.R. (2002) J. Chem. Phys. 117:7259–7265",
  // Defaults are Morphokin's choice (not the paper's) and show a wave instability.
  form: "x_t = a − (1 + b)x + x²y − cx + dz + Dx∇²x, y_t = bx − x²y + Dy∇²y, z_t = cx − dz + Dz∇²z",
  species: ["x", "y", "z"],
  parameters: [
    param("a", "feed of x", 2, 1e-6, 100),
    param("b", "conversion rate x → y", 9.7, 0, 1000),
    param("c", "exchange rate x → z", 4, 0, 1000),
    param("d", "exchange rate z → x", 2, 1e-6, 1000),
    param("Dx", "diffusivity of x", 0.01, 1e-9, 1e9),
    param("Dy", "diffusivity of y", 0.01, 1e-9, 1e9),
    param("Dz", "diffusivity of z", 10, 1e-9, 1e9),
  ],
  reactions: ["a - (1 + b) * x + x^2 * y - c * x + d * z", "b * x - x^2 * y", "c * x - d * z"],
  diffusion: ["Dx", "Dy", "Dz"],
  rates(s, p, out) {
    const x = s[0],
      y = s[1],
      z = s[2],
      a = p[0],
      b = p[1],
      c = p[2],
      d = p[3];
    out[0] = a - (1 + b) * x + x * x * y - c * x + d * z;
    out[1] = b * x - x * x * y;
    out[2] = c * x - d * z;
  },
  jacobian(s, p, out) {
    const x = s[0],
      y = s[1],
      b = p[1],
      c = p[2],
      d = p[3];
    out[0] = -(1 + b) + 2 * x * y - c;
    out[1] = x * x;
    out[2] = d;
    out[3] = b - 2 * x * y;
    out[4] = -x * x;
    out[5] = 0;
    out[6] = c;
    out[7] = 0;
    out[8] = -d;
  },
  diffusionValues(p, out) {
    out.fill(0);
    out[0] = p[4];
    out[4] = p[5];
    out[8] = p[6];
  },
  // (x*, y*, z*) = (a, b/a, ca/d): cx − dz = 0 reduces the x equation to the Brusselator's.
  steadyStates(p, out) {
    out[0] = p[0];
    out[1] = p[1] / p[0];
    out[2] = (p[2] * p[0]) / p[3];
    return 1;
  },
  steadyStateForm: "explicit",
});
