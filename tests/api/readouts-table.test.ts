/**
 * Table readouts through the API: hand-computed statistics for 1-D positions and 2-D centroids,
 * and a re-run with an explicit column mapping.
 */
import { describe, expect, it } from "vitest";
import type { ReadoutDto } from "@/lib/server/readouts/readouts";
import { database } from "@/lib/server/services";
import { setupReadoutLab } from "../support/readouts";

const { api, newSpecimen, uploadFile, finished } = setupReadoutLab();

describe("table readouts", () => {
  it("1-D positions: n, mean, SD, SEM, CV, median and 95 % CI by hand", async () => {
    // Positions 0, 10, 21, 30, 41 µm → spacings 10, 11, 9, 11 (hand-computed): mean 10.25,
    // SD √(2.75/3) = 0.957427, SEM 0.478714, CV 0.093408, median 10.5,
    // CI 10.25 ± t(0.975, 3)·SEM with t = 3.182446 (Student t table) = [8.726528, 11.773472].
    const csv = "position_um\n0\n10\n21\n30\n41\n";
    const up = await uploadFile((await newSpecimen()).id, "positions.csv", new TextEncoder().encode(csv));
    const r = await finished(up.body.readout);
    expect(r.status).toBe("succeeded");
    if (r.result?.type !== "table" || r.result.table.kind !== "positions-1d")
      throw new Error("expected a 1-D positions readout");
    expect(r.result.mapping).toMatchObject({ position: "position_um", unit: "um", guessed: true });
    const s = r.result.table.spacingUm;
    expect(s.n).toBe(4);
    expect(s.mean).toBeCloseTo(10.25, 10);
    expect(s.sd).toBeCloseTo(0.957427, 5);
    expect(s.sem).toBeCloseTo(0.478714, 5);
    expect(s.cv).toBeCloseTo(0.093408, 5);
    expect(s.median).toBe(10.5);
    expect(s.ci95[0]).toBeCloseTo(8.726528, 4);
    expect(s.ci95[1]).toBeCloseTo(11.773472, 4);
    expect(r.headline).toMatchObject({ measure: "mean-spacing-1d", wavelengthUm: 10.25 });

    // The readouts list shows the same headline: stored with the result, and for a readout finished
    // before that column (headline null), read from its result.
    const listed = async () => {
      const res = await api("GET /api/v1/labs/[labId]/readouts", {}, { query: `uploadId=${up.body.id}` });
      const items = ((await res.json()) as { items: ReadoutDto[] }).items;
      return items.find((x) => x.id === r.id)!.headline;
    };
    expect(await listed()).toEqual(r.headline);
    const m = await database();
    const stored = (await m.Readout.findByPk(r.id))!.headline;
    expect(stored).toEqual(r.headline);
    await m.Readout.update({ headline: null }, { where: { id: r.id } });
    try {
      expect(await listed()).toEqual(r.headline);
    } finally {
      await m.Readout.update({ headline: stored }, { where: { id: r.id } });
    }
  });

  it("2-D centroids of a square lattice: NN distance, Clark–Evans R and the hexagonal-equivalent wavelength", async () => {
    // 4 × 4 points 10 µm apart (geometry): every NN distance is 10 µm; density 16/30² per µm²,
    // R = 10 / (0.5/√density) = 10/3.75 = 2.6667 (Clark & Evans 1954); λ_hex = (√3/2)·10 = 8.6603 µm.
    const rows = ["cx (nm),cy (nm)"];
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) rows.push(`${i * 10_000},${j * 10_000}`);
    const up = await uploadFile((await newSpecimen()).id, "centroids.csv", new TextEncoder().encode(rows.join("\n")));
    const r = await finished(up.body.readout);
    if (r.result?.type !== "table" || r.result.table.kind !== "centroids-2d")
      throw new Error("expected a centroids readout");
    expect(r.result.mapping).toMatchObject({ x: "cx (nm)", y: "cy (nm)", unit: "nm" });
    expect(r.result.table.nearestNeighbourUm.mean).toBeCloseTo(10, 9);
    expect(r.result.table.clarkEvansR).toBeCloseTo(2.666667, 5);
    expect(r.result.table.equivalentHexWavelengthUm).toBeCloseTo(8.660254, 5);
  });

  it("a re-run with an explicit column mapping and unit", async () => {
    const csv = "a,b\n1,2\n3,4\n6,5\n";
    const up = await uploadFile((await newSpecimen()).id, "ab.csv", new TextEncoder().encode(csv));
    const r = await finished(up.body.readout);
    expect(r.status).toBe("failed");
    expect(r.error).toBe(
      'Could not tell from the header which columns to read. Choose the columns in the form (x and y, or position, or spacing); the columns are: A ("a"), B ("b").',
    );
    const res = await api(
      "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts",
      { uploadId: up.body.id },
      { json: { columns: { spacing: "a" }, unit: "mm" } },
    );
    const again = await finished((await res.json()) as ReadoutDto);
    // Spacings 1, 3, 6 mm → mean 3333.33 µm (hand-computed).
    expect(again.headline!.wavelengthUm).toBeCloseTo(10_000 / 3, 6);
  });
});
