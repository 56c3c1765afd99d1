import { describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeTuringMapParallel } from "@/lib/parallel";
import { CLASS_HOPF, CLASS_TURING, computeDispersion, computeTuringMap } from "@/lib/stability";

const brusselator = getCatalogueKinetics("brusselator");

describe("computeTuringMap", () => {
  const map = computeTuringMap(brusselator, {
    x: { name: "b", min: 1, max: 4, n: 31 }, y: { name: "Dv", min: 2, max: 50, n: 25, scale: "log" },
    parameters: { a: 1.5, Du: 1 }, target: { wavelength: 8, tolerance: 0.5 },
  });

  it("marks Turing exactly where b > b_c = (1 + a√(Du/Dv))² (Prigogine & Lefever 1968) and Hopf where b > 1 + a²", () => {
    let checked = 0;
    map.y.values.forEach((Dv, iy) => map.x.values.forEach((b, ix) => {
      const bc = (1 + 1.5 * Math.sqrt(1 / Dv)) ** 2;
      if (Math.abs(b - bc) < 1e-6 || Math.abs(b - 3.25) < 1e-6) return; // on a threshold: either answer is right
      const c = map.classes[iy * map.nx + ix];
      expect((c & CLASS_TURING) !== 0).toBe(b > bc);
      expect((c & CLASS_HOPF) !== 0).toBe(b > 3.25);
      checked++;
    }));
    expect(checked).toBeGreaterThan(700);
  });

  it("fast 2×2 cells agree with computeDispersion (class and wavelength to 1e-7)", () => {
    for (const [ix, iy] of [[5, 3], [20, 10], [30, 24], [12, 18], [25, 0]]) {
      const r = computeDispersion(brusselator, { a: 1.5, Du: 1, b: map.x.values[ix], Dv: map.y.values[iy] });
      const cell = iy * map.nx + ix;
      expect(map.classes[cell]).toBe(r.classification.flags);
      if (r.fastest) expect(Math.abs(map.wavelength[cell] / r.fastest.wavelength - 1)).toBeLessThan(1e-7);
      else expect(map.wavelength[cell]).toBeNaN();
    }
  });

  it("turing fraction, target cells and contour are consistent with the cells", () => {
    let turing = 0;
    map.classes.forEach((c) => (turing += c & CLASS_TURING ? 1 : 0));
    expect(map.turingFraction).toBe(turing / (map.nx * map.ny));
    const t = map.target!;
    expect(t.matchCount).toBeGreaterThan(0);
    t.match.forEach((m, i) => { if (m) expect(Math.abs(map.wavelength[i] - 8)).toBeLessThanOrEqual(0.5); });
    expect(t.contour.length).toBeGreaterThan(0);
    // a contour point, re-evaluated directly, has a wavelength near the target (linear interpolation between cells)
    const [b, Dv] = t.contour[Math.floor(t.contour.length / 2)];
    const r = computeDispersion(brusselator, { a: 1.5, Du: 1, b, Dv });
    expect(Math.abs(r.fastest!.wavelength - 8)).toBeLessThan(0.2);
  });

  it("worker threads give the same cells as this thread", async () => {
    const options = { x: { name: "a", min: 0.05, max: 0.4, n: 24 }, y: { name: "d", min: 2, max: 60, n: 20, scale: "log" as const } };
    const local = computeTuringMap(getCatalogueKinetics("schnakenberg"), options);
    const par = await computeTuringMapParallel({ catalogue: "schnakenberg" }, options, { workers: 2 });
    expect(par.workers).toBe(2);
    expect(Array.from(par.classes)).toEqual(Array.from(local.classes));
    expect(Array.from(par.wavelength)).toEqual(Array.from(local.wavelength));
  });
});
