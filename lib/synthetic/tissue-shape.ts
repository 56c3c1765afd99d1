/** The outline of the tissue in a generated frame. */
export type TissueShape = "ellipse" | "half-disc";

type Distance = (x: number, y: number) => number;

/** An ellipse of semi-axes (s·W/2, 0.8·s·H/2), rotated, centred a little off the frame centre. */
function ellipse(width: number, height: number, angleDeg: number, s: number): Distance {
  const a = (s * width) / 2,
    b = (0.8 * s * height) / 2;
  const cx = 0.52 * width,
    cy = 0.48 * height;
  const c = Math.cos((angleDeg * Math.PI) / 180),
    sn = Math.sin((angleDeg * Math.PI) / 180);
  return (x, y) => {
    const dx = x - cx,
      dy = y - cy;
    const u = (c * dx + sn * dy) / a,
      v = (-sn * dx + c * dy) / b;
    const rho = Math.hypot(u, v);
    // Signed distance along the ray from the centre: exact on that ray, close to the true distance for mild ellipses.
    return rho > 0 ? Math.hypot(dx, dy) * (1 / rho - 1) : Math.min(a, b);
  };
}

/** A disc of radius s·H centred on the middle of the left edge: half a section running off the frame. */
function halfDisc(width: number, height: number, s: number): Distance {
  const R = s * height;
  return (x, y) => R - Math.hypot(x, y - height / 2);
}

function coverageOf(d: Distance, width: number, height: number): number {
  let n = 0;
  for (let y = 0; y < height; y += 2) for (let x = 0; x < width; x += 2) if (d(x, y) >= 0) n++;
  return n / (Math.ceil(height / 2) * Math.ceil(width / 2));
}

/**
 * Signed distance (px, positive inside) to the edge of a tissue of the given shape, scaled by
 * bisection so that it covers `coverage` of the frame.
 */
export function tissueSignedDistance(
  shape: TissueShape,
  width: number,
  height: number,
  coverage: number,
  angleDeg: number,
): Distance {
  const make = (s: number) => (shape === "ellipse" ? ellipse(width, height, angleDeg, s) : halfDisc(width, height, s));
  let lo = 0.01,
    hi = 4;
  for (let k = 0; k < 30; k++) {
    const mid = (lo + hi) / 2;
    if (coverageOf(make(mid), width, height) < coverage) lo = mid;
    else hi = mid;
  }
  return make((lo + hi) / 2);
}
