import { describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeTuringMapParallel } from "@/lib/parallel";
import {
  CLASS_HOPF,
  CLASS_PEAK,
  classOf,
  computeDispersion,
  computeTuringMap,
  isTuring,
  MAP_CLASSES,
} from "@/lib/stability";

const brusselator = getCatalogueKinetics("brusselator");

describe("computeTuringMap", () => {
  const map = computeTuringMap(brusselator, {
    x: { name: "b", min: 1, max: 4, n: 31 },
    y: { name: "Dv", min: 2, max: 50, n: 25, scale: "log" },
    parameters: { a: 1.5, Du: 1 },
    target: { wavelength: 8, tolerance: 0.5 },
  });

  it("marks Turing exactly where b > b_c = (1 + a√(Du/Dv))² (Prigogine & Lefever 1968) and Hopf where b > 1 + a²", () => {
    let checked = 0;
    map.y.values.forEach((Dv, iy) =>
      map.x.values.forEach((b, ix) => {
        const bc = (1 + 1.5 * Math.sqrt(1 / Dv)) ** 2;
        if (Math.abs(b - bc) < 1e-6 || Math.abs(b - 3.25) < 1e-6) return; // on a threshold: either answer is right
        const c = map.classes[iy * map.nx + ix];
        expect((c & CLASS_PEAK) !== 0).toBe(b > bc);
        expect((c & CLASS_HOPF) !== 0).toBe(b > 3.25);
        checked++;
      }),
    );
    expect(checked).toBeGreaterThan(700);
  });

  it("fast 2×2 cells agree with computeDispersion (class and wavelength to 1e-7)", () => {
    for (const [ix, iy] of [
      [5, 3],
      [20, 10],
      [30, 24],
      [12, 18],
      [25, 0],
    ]) {
      const r = computeDispersion(brusselator, { a: 1.5, Du: 1, b: map.x.values[ix], Dv: map.y.values[iy] });
      const cell = iy * map.nx + ix;
      expect(map.classes[cell]).toBe(r.classification.flags);
      if (r.fastest) expect(Math.abs(map.wavelength[cell] / r.fastest.wavelength - 1)).toBeLessThan(1e-7);
      else expect(map.wavelength[cell]).toBeNaN();
    }
  });

  it("turing fraction, target cells and contour are consistent with the cells", () => {
    let turing = 0;
    map.classes.forEach((c) => (turing += isTuring(c) ? 1 : 0));
    expect(map.turingFraction).toBe(turing / (map.nx * map.ny));
    expect(map.counts.turing).toBe(turing);
    const t = map.target!;
    expect(t.matchCount).toBeGreaterThan(0);
    t.match.forEach((m, i) => {
      if (m) {
        expect(Math.abs(map.wavelength[i] - 8)).toBeLessThanOrEqual(0.5);
        expect(isTuring(map.classes[i])).toBe(true);
      }
    });
    expect(t.contour.length).toBeGreaterThan(0);
    // a contour point, re-evaluated directly, has a wavelength near the target (linear interpolation between cells)
    const [b, Dv] = t.contour[Math.floor(t.contour.length / 2)];
    const r = computeDispersion(brusselator, { a: 1.5, Du: 1, b, Dv });
    expect(Math.abs(r.fastest!.wavelength - 8)).toBeLessThan(0.2);
  });

  it("worker threads give the same cells as this thread", async () => {
    const options = {
      x: { name: "a", min: 0.05, max: 0.4, n: 24 },
      y: { name: "d", min: 2, max: 60, n: 20, scale: "log" as const },
    };
    const local = computeTuringMap(getCatalogueKinetics("schnakenberg"), options);
    const par = await computeTuringMapParallel({ catalogue: "schnakenberg" }, options, { workers: 2 });
    expect(par.workers).toBe(2);
    expect(Array.from(par.classes)).toEqual(Array.from(local.classes));
    expect(Array.from(par.wavelength)).toEqual(Array.from(local.wavelength));
  });
});

describe("one definition of Turing on the map (stable at k = 0, unstable at some k > 0)", () => {
  // The box of the review: Schnakenberg γ = 1, d = 20, a ∈ [0.02, 0.5] × b ∈ [0.18, 4.5], 60 × 60 cells.
  const schnakenberg = getCatalogueKinetics("schnakenberg");
  const map = computeTuringMap(schnakenberg, {
    x: { name: "a", min: 0.02, max: 0.5, n: 60 },
    y: { name: "b", min: 0.18, max: 4.5, n: 60 },
    parameters: { gamma: 1, d: 20 },
  });

  it("agrees cell by cell with the closed-form two-species Turing conditions (Murray 2003, Mathematical Biology II, eqs. 2.27–2.30)", () => {
    const d = 20;
    let expected = 0,
      disagreements = 0,
      marginal = 0;
    map.y.values.forEach((b, iy) =>
      map.x.values.forEach((a, ix) => {
        // Steady state u* = a + b, v* = b/(a + b)² and its Jacobian (Murray 2003 §2.4).
        const u = a + b,
          v = b / (u * u);
        const fu = -1 + 2 * u * v,
          fv = u * u,
          gu = -2 * u * v,
          gv = -u * u;
        const tr = fu + gv,
          det = fu * gv - fv * gu,
          h = d * fu + gv;
        const turing = tr < 0 && det > 0 && h > 0 && h * h > 4 * d * det;
        // Cells within rounding of a threshold may go either way.
        const edge = Math.min(Math.abs(tr), Math.abs(h * h - 4 * d * det) / (h * h + 4 * d * det)) < 1e-9;
        if (edge) {
          marginal++;
          return;
        }
        if (turing) expected++;
        if (isTuring(map.classes[iy * map.nx + ix]) !== turing) disagreements++;
      }),
    );
    expect(marginal).toBeLessThan(5);
    expect(disagreements).toBe(0);
    expect(Math.abs(map.counts.turing - expected)).toBeLessThanOrEqual(marginal);
    expect(map.turingFraction).toBeCloseTo(map.counts.turing / 3600, 15);
    // A growth peak at k > 0 on top of a Hopf instability is its own class, not Turing.
    expect(map.counts["turing-hopf"]).toBeGreaterThan(0);
  });

  it("counts one exclusive class per cell, so the counts add up to the cells", () => {
    const total = MAP_CLASSES.reduce((s, c) => s + (map.counts[c.name] ?? 0), 0);
    expect(total).toBe(map.nx * map.ny);
    expect(Object.keys(map.counts).sort()).toEqual(MAP_CLASSES.map((c) => c.name).sort());
    const recount: Record<string, number> = {};
    map.classes.forEach((c) => (recount[classOf(c)] = (recount[classOf(c)] ?? 0) + 1));
    for (const [name, n] of Object.entries(recount)) expect(map.counts[name]).toBe(n);
    // Every cell with a k > 0 peak and a Hopf bit is "turing-hopf", never "turing" (Murray 2003 ch. 2: Turing needs stability at k = 0).
    map.classes.forEach((c) => {
      if (c & CLASS_HOPF && c & CLASS_PEAK) expect(classOf(c)).toBe("turing-hopf");
    });
  });
});
