/**
 * The study's condition comparison (JSON and CSV): Welch's test, specimens as replicates,
 * conditions matched regardless of case.
 */
import Papa from "papaparse";
import { jStat } from "jstat";
import { describe, expect, it } from "vitest";
import type { ConditionComparison } from "@/lib/server/readouts/comparison-types";
import { createStudy } from "@/lib/server/studies/studies";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { errorOf } from "../support/lab-api";
import { setupReadoutLab } from "../support/readouts";

const { ctxOf, api, uploadFile, finished } = setupReadoutLab();

describe("condition comparison", () => {
  it("groups the latest readout per upload by condition, with Welch's t-test, Hedges' g and a CSV", async () => {
    const compStudy = await createStudy(ctxOf(), {
      name: "Comparison study",
      tissue: "skin",
      organism: "chick",
      description: null,
    });
    const means: Record<string, number[]> = { control: [10, 11, 12], treated: [14, 15, 17] };
    for (const [condition, values] of Object.entries(means)) {
      for (const v of values) {
        const sp = await createSpecimen(ctxOf(), compStudy.id, {
          label: `${condition}-${v}`,
          condition,
          stage: null,
          genotype: null,
          notes: null,
        });
        const up = await uploadFile(
          sp.id,
          `${condition}-${v}.csv`,
          new TextEncoder().encode(`spacing_um\n${v - 1}\n${v + 1}\n`),
        );
        await finished(up.body.readout);
      }
    }
    const res = await api(
      "GET /api/v1/labs/[labId]/studies/[studyId]/comparison",
      { studyId: compStudy.id },
      { query: "a=control&b=treated" },
    );
    expect(res.status).toBe(200);
    const c = (await res.json()) as ConditionComparison;
    expect(c.groups.map((g) => [g.condition, g.n])).toEqual([
      ["control", 3],
      ["treated", 3],
    ]);
    // control 10, 11, 12: mean 11, SD 1, CI 11 ± 4.302653/√3 (t(0.975, 2) from a t table) = [8.515862, 13.484138].
    expect(c.groups[0].meanUm).toBeCloseTo(11, 10);
    expect(c.groups[0].ci95Um![0]).toBeCloseTo(8.515862, 4);
    expect(c.groups[0].ci95Um![1]).toBeCloseTo(13.484138, 4);
    // Welch by hand: variances 1 and 7/3, se² = 10/9, t = −4.3333/1.054093 = −4.110961,
    // df = (10/9)² / ((1/3)²/2 + (7/9)²/2) = 3.448276; p from jstat's t distribution (reference library).
    // Hedges' g: pooled SD √(5/3) = 1.290994, d = −3.356586, J = 1 − 3/15 = 0.8 → g = −2.685269.
    const wt = c.test.welch!;
    expect(wt.t).toBeCloseTo(-4.110961, 5);
    expect(wt.df).toBeCloseTo(3.448276, 5);
    expect(wt.pValue).toBeCloseTo(2 * jStat.studentt.cdf(-4.110961, 3.448276), 5);
    expect(wt.hedgesG).toBeCloseTo(-2.685269, 5);

    const csvRes = await api(
      "GET /api/v1/labs/[labId]/studies/[studyId]/comparison/csv",
      { studyId: compStudy.id },
      { query: "a=control&b=treated" },
    );
    expect(csvRes.headers.get("content-type")).toContain("text/csv");
    const parsed = Papa.parse<Record<string, string>>(await csvRes.text(), {
      header: true,
      comments: "#",
      skipEmptyLines: true,
    });
    expect(parsed.data).toHaveLength(6);
    expect(parsed.data.map((r) => Number(r.wavelength_um))).toEqual([10, 11, 12, 14, 15, 17]);
    expect(Number(parsed.data[0].condition_mean_um)).toBeCloseTo(11, 10);

    const bad = await api(
      "GET /api/v1/labs/[labId]/studies/[studyId]/comparison",
      { studyId: compStudy.id },
      { query: "a=nope" },
    );
    expect(bad.status).toBe(400);
    expect((await errorOf(bad)).message).toBe(
      "a: the study has no condition “nope” (its conditions are: control, treated)",
    );
  });

  it("counts specimens, not images: 3 specimens × 2 images per condition are averaged per specimen first, and a re-uploaded identical file counts once", async () => {
    const study = await createStudy(ctxOf(), {
      name: "Replicates study",
      tissue: "skin",
      organism: "chick",
      description: null,
    });
    // Each image is a table whose mean spacing is the value (x − 1 and x + 1); specimen means by hand:
    // control 11, 13.25, 9.5; treated 16, 14.25, 18.5.
    const design: Record<string, number[][]> = {
      control: [
        [10, 12],
        [13, 13.5],
        [8.5, 10.5],
      ],
      treated: [
        [15, 17],
        [14, 14.5],
        [18, 19],
      ],
    };
    const table = (x: number) => new TextEncoder().encode(`spacing_um\n${x - 1}\n${x + 1}\n`);
    let firstSpecimen = "";
    for (const [condition, specimens] of Object.entries(design)) {
      for (const [i, images] of specimens.entries()) {
        const sp = await createSpecimen(ctxOf(), study.id, {
          label: `${condition}-${i + 1}`,
          condition,
          stage: null,
          genotype: null,
          notes: null,
        });
        firstSpecimen ||= sp.id;
        for (const x of images)
          await finished((await uploadFile(sp.id, `${condition}-${i + 1}-${x}.csv`, table(x))).body.readout);
      }
    }
    // The first image of control-1 uploaded again under another name: same SHA-256, counted once.
    await finished((await uploadFile(firstSpecimen, "again.csv", table(10))).body.readout);

    const res = await api(
      "GET /api/v1/labs/[labId]/studies/[studyId]/comparison",
      { studyId: study.id },
      { query: "a=control&b=treated" },
    );
    const c = (await res.json()) as ConditionComparison;
    expect(c.replicate).toBe("specimen");
    expect(c.groups.map((g) => [g.condition, g.n, g.nSpecimens, g.nImages])).toEqual([
      ["control", 3, 3, 6],
      ["treated", 3, 3, 6],
    ]);
    expect(c.groups[0].specimens.map((x) => [x.specimenLabel, x.wavelengthUm, x.images])).toEqual([
      ["control-1", 11, 2],
      ["control-2", 13.25, 2],
      ["control-3", 9.5, 2],
    ]);
    expect(c.excluded).toEqual([
      expect.objectContaining({
        filename: "again.csv",
        reason: "the same file as “control-1-10.csv” of this specimen (identical SHA-256), counted once",
      }),
    ]);
    // By hand over the specimen means: control mean 11.25, variance 3.5625; treated 16.25, variance 4.5625.
    // CI: 11.25 ± 4.302653 · √3.5625/√3 (t(0.975, 2) from a t table) = [6.561293, 15.938707].
    expect(c.groups[0].meanUm).toBeCloseTo(11.25, 10);
    expect(c.groups[0].sdUm).toBeCloseTo(Math.sqrt(3.5625), 10);
    expect(c.groups[0].ci95Um![0]).toBeCloseTo(6.561293, 4);
    expect(c.groups[0].ci95Um![1]).toBeCloseTo(15.938707, 4);
    // Welch by hand: se² = (3.5625 + 4.5625)/3 = 2.708333, t = −5/√se² = −3.038218,
    // df = se⁴ / ((3.5625/3)²/2 + (4.5625/3)²/2) = 3.940312; Hedges' g = −5/√4.0625 · (1 − 3/15) = −1.984556.
    const wt = c.test.welch!;
    expect(wt.t).toBeCloseTo(-3.038218, 5);
    expect(wt.df).toBeCloseTo(3.940312, 5);
    expect(wt.hedgesG).toBeCloseTo(-1.984556, 5);
    expect(c.warnings).toEqual([]);

    // Counting every image instead: n = 6, t = −4.371302, df = 9.959594 (by hand, same formulas) — with a warning.
    const imgRes = await api(
      "GET /api/v1/labs/[labId]/studies/[studyId]/comparison",
      { studyId: study.id },
      { query: "a=control&b=treated&replicate=image" },
    );
    const img = (await imgRes.json()) as ConditionComparison;
    expect(imgRes.status, JSON.stringify(img)).toBe(200);
    expect(img.groups.map((g) => g.n)).toEqual([6, 6]);
    expect(img.test.welch!.t).toBeCloseTo(-4.371302, 5);
    expect(img.test.welch!.df).toBeCloseTo(9.959594, 5);
    expect(img.warnings[0]).toMatch(
      /^Every image counts as a replicate here, but images of one specimen are not independent \(pseudo-replication\)/,
    );

    const csv = Papa.parse<Record<string, string>>(
      await (
        await api(
          "GET /api/v1/labs/[labId]/studies/[studyId]/comparison/csv",
          { studyId: study.id },
          { query: "a=control&b=treated" },
        )
      ).text(),
      { header: true, comments: "#", skipEmptyLines: true },
    );
    expect(csv.data).toHaveLength(12);
    expect(
      csv.data
        .filter((r) => r.specimen === "control-2")
        .map((r) => [
          Number(r.specimen_mean_um),
          Number(r.specimen_images),
          Number(r.condition_n),
          Number(r.condition_images),
        ]),
    ).toEqual([
      [13.25, 2, 3, 6],
      [13.25, 2, 3, 6],
    ]);

    const wrong = await api(
      "GET /api/v1/labs/[labId]/studies/[studyId]/comparison",
      { studyId: study.id },
      { query: "replicate=slide" },
    );
    expect(wrong.status).toBe(400);
    expect((await errorOf(wrong)).message).toBe(
      "replicate: choose “specimen” (biological replicates, the default) or “image”",
    );
  }, 120_000);

  it("takes “Kontrolle” and “kontrolle” as one condition, shown as first spelled, with a warning", async () => {
    const study = await createStudy(ctxOf(), {
      name: "Spelling study",
      tissue: "skin",
      organism: "chick",
      description: null,
    });
    for (const [label, condition, x] of [
      ["K1", "Kontrolle", 20],
      ["K2", "kontrolle", 22],
      ["T1", "treated", 30],
      ["T2", "Treated ", 31],
    ] as const) {
      const sp = await createSpecimen(ctxOf(), study.id, {
        label,
        condition,
        stage: null,
        genotype: null,
        notes: null,
      });
      await finished(
        (await uploadFile(sp.id, `${label}.csv`, new TextEncoder().encode(`spacing_um\n${x - 1}\n${x + 1}\n`))).body
          .readout,
      );
    }
    const c = (await (
      await api(
        "GET /api/v1/labs/[labId]/studies/[studyId]/comparison",
        { studyId: study.id },
        { query: "a=KONTROLLE&b=treated" },
      )
    ).json()) as ConditionComparison;
    expect(c.conditions).toEqual(["Kontrolle", "treated"]);
    expect(c.groups.map((g) => [g.condition, g.n, g.meanUm])).toEqual([
      ["Kontrolle", 2, 21],
      ["treated", 2, 30.5],
    ]);
    expect(c.test.a).toBe("Kontrolle");
    expect(c.warnings).toContain(
      "“Kontrolle” and “kontrolle” were taken as one condition (conditions are matched without regard to case and spaces).",
    );
  }, 60_000);
});
