/**
 * Marching squares (Lorensen & Cline 1987, 2-D case) for the level f = 0 of a cell-centred
 * field; squares touching a NaN are skipped. Segments are returned in fractional cell-index
 * coordinates (ix, iy); the caller maps them to parameter values.
 */
export function contourSegments(f: Float64Array, nx: number, ny: number): [number, number, number, number][] {
  const segs: [number, number, number, number][] = [];
  const cross = (a: number, b: number) => a / (a - b);
  for (let iy = 0; iy < ny - 1; iy++) {
    for (let ix = 0; ix < nx - 1; ix++) {
      const v00 = f[iy * nx + ix],
        v10 = f[iy * nx + ix + 1],
        v01 = f[(iy + 1) * nx + ix],
        v11 = f[(iy + 1) * nx + ix + 1];
      if (Number.isNaN(v00 + v10 + v01 + v11)) continue;
      const pts: [number, number][] = [];
      if (v00 > 0 !== v10 > 0) pts.push([ix + cross(v00, v10), iy]);
      if (v10 > 0 !== v11 > 0) pts.push([ix + 1, iy + cross(v10, v11)]);
      if (v01 > 0 !== v11 > 0) pts.push([ix + cross(v01, v11), iy + 1]);
      if (v00 > 0 !== v01 > 0) pts.push([ix, iy + cross(v00, v01)]);
      if (pts.length === 2) segs.push([pts[0][0], pts[0][1], pts[1][0], pts[1][1]]);
      else if (pts.length === 4) {
        // Saddle square: pair edges by the sign of the centre value (asymptotic decider simplified).
        const centre = 0.25 * (v00 + v10 + v01 + v11);
        if (centre > 0 === v00 > 0) {
          segs.push([pts[0][0], pts[0][1], pts[1][0], pts[1][1]], [pts[2][0], pts[2][1], pts[3][0], pts[3][1]]);
        } else {
          segs.push([pts[0][0], pts[0][1], pts[3][0], pts[3][1]], [pts[1][0], pts[1][1], pts[2][0], pts[2][1]]);
        }
      }
    }
  }
  return segs;
}
