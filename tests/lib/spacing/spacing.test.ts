import { describe, expect, it } from "vitest";
import {
  computeNearestNeighbours,
  readSpacingTable,
  spacingsFromPositions,
  summarize,
  welchTTest,
} from "@/lib/spacing";
import { createRng } from "@/lib/synthetic";

describe("summarize", () => {
  it("known sample 2,4,4,4,5,5,7,9: mean 5, SD √(32/7), t₀.₉₇₅,₇ = 2.3646 (Student t table)", () => {
    const s = summarize([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(s.mean).toBe(5);
    expect(s.sd).toBeCloseTo(Math.sqrt(32 / 7), 12);
    expect(s.sem).toBeCloseTo(Math.sqrt(32 / 7) / Math.sqrt(8), 12);
    expect(s.median).toBe(4.5);
    expect(s.ci95[1] - s.mean).toBeCloseTo(2.3646 * s.sem, 3);
  });
});

describe("welchTTest", () => {
  // Equal n = 6 and equal variances make Welch's df exactly 2(n − 1) = 10 (Welch–Satterthwaite formula);
  // the shift is chosen so that t = 2.228139, the two-sided 5 % critical value for 10 df (t table).
  const a = [0, 1, 2, 3, 4, 5];
  const se = Math.sqrt((3.5 / 6) * 2);
  const b = a.map((v) => v - 2.228139 * se);
  it("t, df and p match the t table", () => {
    const r = welchTTest(a, b);
    expect(r.t).toBeCloseTo(2.228139, 5);
    expect(r.df).toBeCloseTo(10, 10);
    expect(r.pValue).toBeCloseTo(0.05, 4);
    expect(r.ci95[0]).toBeCloseTo(0, 5); // CI edge touches 0 exactly at p = 0.05 (duality of test and interval)
  });
  it("Hedges' g = d/s_pooled × (1 − 3/(4·12 − 9)) (Hedges 1981)", () => {
    expect(welchTTest(a, b).hedgesG).toBeCloseTo(((2.228139 * se) / Math.sqrt(3.5)) * (1 - 3 / 39), 5);
  });
});

describe("nearest neighbours vs lattice geometry", () => {
  it("square lattice spacing s: every NN = s, Clark–Evans R = s/(0.5·s) = 2 (geometry)", () => {
    const xs: number[] = [],
      ys: number[] = [];
    for (let i = 0; i < 40; i++)
      for (let j = 0; j < 30; j++) {
        xs.push(i * 7);
        ys.push(j * 7);
      }
    const r = computeNearestNeighbours(xs, ys, { minX: -3.5, minY: -3.5, maxX: 40 * 7 - 3.5, maxY: 30 * 7 - 3.5 });
    expect(r.all.mean).toBeCloseTo(7, 10);
    expect(r.all.sd).toBeCloseTo(0, 10);
    expect(r.clarkEvansR).toBeCloseTo(2, 10);
  });
  it("hexagonal lattice NN a: R = 1/(0.5·(√3/2)^½) ≈ 2.149 (Clark & Evans 1954) and λ = (√3/2)·a; 90 000 points", () => {
    const a = 10,
      h = (Math.sqrt(3) / 2) * a,
      nx = 300,
      ny = 300;
    const xs = new Float64Array(nx * ny),
      ys = new Float64Array(nx * ny);
    for (let j = 0; j < ny; j++)
      for (let i = 0; i < nx; i++) {
        xs[j * nx + i] = i * a + (j % 2 ? a / 2 : 0);
        ys[j * nx + i] = j * h;
      }
    // each point owns an a × h cell, so this field has exactly the lattice density
    const r = computeNearestNeighbours(xs, ys, {
      minX: -a / 4,
      minY: -h / 2,
      maxX: nx * a - a / 4,
      maxY: ny * h - h / 2,
    });
    expect(r.all.mean).toBeCloseTo(a, 9);
    expect(r.clarkEvansR).toBeCloseTo(1 / (0.5 * Math.sqrt(Math.sqrt(3) / 2)), 6);
    expect(r.clarkEvansR).toBeCloseTo(2.149, 3);
    expect(r.equivalentHexWavelength).toBeCloseTo(h, 9);
  });
  it("uniform random points: R ≈ 1 for the interior-corrected mean (Poisson: E[NN] = 0.5/√ρ, Clark & Evans 1954)", () => {
    const rng = createRng(11);
    const n = 20000;
    const xs = Float64Array.from({ length: n }, () => rng.uniform() * 1000);
    const ys = Float64Array.from({ length: n }, () => rng.uniform() * 1000);
    const r = computeNearestNeighbours(xs, ys, { minX: 0, minY: 0, maxX: 1000, maxY: 1000 });
    const expected = 0.5 / Math.sqrt(n / 1e6);
    expect(r.interior!.mean / expected).toBeGreaterThan(0.97);
    expect(r.interior!.mean / expected).toBeLessThan(1.03);
    expect(r.all.mean).toBeGreaterThan(r.interior!.mean); // edge points have biased-up NN
  });
});

describe("tables", () => {
  it("1-D positions: mean spacing = (last − first)/(n − 1) (telescoping sum), unit conversion nm → µm", () => {
    const r = readSpacingTable("pos_nm\n3000\n1000\n12000\n7000\n", { position: "pos_nm", unit: "nm" });
    expect(r.kind).toBe("positions-1d");
    if (r.kind !== "positions-1d") return;
    expect(r.meanSpacingUm).toBeCloseTo(11 / 3, 12);
    expect(r.spacingUm.mean).toBeCloseTo(11 / 3, 12);
    expect(spacingsFromPositions([5, 1, 3]).spacings).toEqual(Float64Array.from([2, 2]));
  });
  it("2-D centroids from TSV in px with a pixel size", () => {
    const rows = ["id\tcx\tcy"];
    for (let i = 0; i < 10; i++) for (let j = 0; j < 10; j++) rows.push(`${i * 10 + j}\t${i * 20}\t${j * 20}`);
    const r = readSpacingTable(rows.join("\n"), { x: "cx", y: "cy", unit: "px", pixelSizeUm: 0.5 });
    expect(r.kind === "centroids-2d" && r.nearestNeighbourUm.mean).toBeCloseTo(10, 12);
  });
  it("a plain spacing list", () => {
    const r = readSpacingTable("spacing\n10\n12\n11\n", { spacing: "spacing" });
    expect(r.kind === "spacings" && r.spacingUm.mean).toBe(11);
  });
});
