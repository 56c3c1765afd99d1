/**
 * The written-out reads of lib/server/db-read.ts give what Sequelize's findAll / count give for the
 * same where, order and page: the same rows, in the same order, with the same values and types
 * (Date, boolean, parsed JSON, null) — on SQLite and on PostgreSQL (this file runs on both).
 * The reference is Sequelize itself; the expected counts are arithmetic on the rows written here.
 */
import { describe, expect, it } from "vitest";
import { Op, type Model, type ModelStatic, type WhereOptions } from "sequelize";
import { CONTAINS_TEXT, readAll, readCount, readOne, readPage, type ReadWhere } from "@/lib/server/db-read";
import { containsText } from "@/lib/server/web/list";
import { database } from "@/lib/server/services";
import { setupLabApi } from "../support/lab-api";
import { seedReadout, seedSpecimen, seedStudy, seedUpload } from "../support/search-fixtures";

const lab = setupLabApi({ who: "scientist" });

async function sameAsSequelize<M extends Model>(
  model: ModelStatic<M>,
  lean: {
    where: ReadWhere;
    attributes?: string[];
    order?: [string, "asc" | "desc"][];
    limit?: number;
    offset?: number;
  },
  where: WhereOptions = lean.where as WhereOptions,
) {
  const mine = await readAll(model, lean);
  const theirs = (
    await model.findAll({
      where,
      attributes: lean.attributes,
      order: lean.order,
      limit: lean.limit,
      offset: lean.offset,
    })
  ).map((r) => r.get({ plain: true }));
  expect(mine).toEqual(theirs);
  expect(await readCount(model, lean.where)).toBe(await model.count({ where }));
  return mine;
}

describe("written-out reads", () => {
  it("give Sequelize's rows, values and types for equality, IN, IS NULL, operators, order and page", async () => {
    const ctx = lab.ctx("scientist");
    const m = await database();
    const study = await seedStudy(ctx, "Bracken leaves, all of the time");
    const specimens = [];
    for (const [label, condition] of [
      ["BF-1", "control"],
      ["BF-2", "control"],
      ["BF-3", "inhibitor_2"],
    ])
      specimens.push(await seedSpecimen(ctx, study.id, { label, condition }));
    const upload = await seedUpload(ctx, specimens[0].id, "frond_scan.png");
    for (const wl of [38.5, 41.25, 44]) await seedReadout(ctx, upload, wl);
    // One readout with nothing found, a JSON result and a null wavelength.
    await m.Readout.create({
      labId: ctx.labId,
      uploadId: upload.id,
      specimenId: upload.specimenId,
      jobId: null,
      status: "failed",
      kind: "image",
      settings: { method: "radial", note: 'it\'s a "quoted" value', nested: [1, 2.5, null] },
      wavelengthUm: null,
      uncertaintyUm: null,
      periodFound: false,
      pixelSizeUm: 0.5,
      inputSha256: "0".repeat(64),
      softwareVersion: "test",
      error: "no period",
      createdBy: ctx.actor.userId,
    });

    const readouts = await sameAsSequelize(m.Readout, {
      where: { labId: ctx.labId },
      order: [
        ["wavelengthUm", "desc"],
        ["id", "asc"],
      ],
    });
    expect(readouts).toHaveLength(4); // 3 found + 1 not found, written above
    const failed = readouts.find((r) => r.status === "failed")!;
    expect(failed.periodFound).toBe(false);
    expect(failed.createdAt).toBeInstanceOf(Date);
    expect(failed.settings).toEqual({ method: "radial", note: 'it\'s a "quoted" value', nested: [1, 2.5, null] });
    expect(readouts.filter((r) => r.periodFound === true)).toHaveLength(3);

    await sameAsSequelize(m.Readout, { where: { labId: ctx.labId, wavelengthUm: null } });
    await sameAsSequelize(m.Readout, {
      where: { labId: ctx.labId, status: ["succeeded", "queued"] },
      attributes: ["id", "wavelengthUm", "createdAt"],
      order: [["wavelengthUm", "asc"]],
      limit: 2,
      offset: 1,
    });
    await sameAsSequelize(m.Readout, { where: { labId: ctx.labId, status: [] } });
    await sameAsSequelize(m.Readout, {
      where: { labId: ctx.labId, wavelengthUm: { [Op.gte]: 41.25 }, error: { [Op.is]: null } },
    });
    await sameAsSequelize(m.Readout, {
      where: {
        labId: ctx.labId,
        status: { [Op.ne]: "failed" },
        [Op.or]: [{ wavelengthUm: 38.5 }, { wavelengthUm: 44 }],
      },
    });
    await sameAsSequelize(m.Specimen, {
      where: { studyId: study.id, condition: { [Op.notIn]: ["inhibitor_2"] } },
      order: [["label", "desc"]],
    });

    const page = await readPage(m.Specimen, {
      where: { studyId: study.id },
      order: [["label", "asc"]],
      limit: 2,
    });
    expect(page.count).toBe(3);
    expect(page.rows.map((s) => s.label)).toEqual(["BF-1", "BF-2"]);
    // A page past the end: no rows, and still the count of all (3 specimens written above).
    expect(await readPage(m.Specimen, { where: { studyId: study.id }, limit: 2, offset: 10 })).toEqual({
      rows: [],
      count: 3,
    });
    expect(await readPage(m.Specimen, { where: { studyId: "00000000-0000-4000-8000-000000000000" } })).toEqual({
      rows: [],
      count: 0,
    });
    const newestFirst = {
      where: { labId: ctx.labId },
      order: [
        ["createdAt", "desc"],
        ["id", "asc"],
      ] as [string, "asc" | "desc"][],
      limit: 3,
      offset: 1,
    };
    const theirs = await m.Readout.findAndCountAll(newestFirst);
    const mine = await readPage(m.Readout, newestFirst);
    expect(mine).toEqual({ rows: theirs.rows.map((r) => r.get({ plain: true })), count: theirs.count });
    expect((await readOne(m.Study, { where: { id: study.id } }))?.name).toBe("Bracken leaves, all of the time");
    expect(await readOne(m.Study, { where: { id: specimens[0].id } })).toBeNull();
  });

  it("match text the way containsText does: % and _ literal, A–Z in either case", async () => {
    const ctx = lab.ctx("scientist");
    const m = await database();
    for (const name of ["Frond 100% dorsal", "Frond 1000 dorsal", "frond_a ventral", "FRONDA ventral"])
      await seedStudy(ctx, name);
    const cases: [string, number][] = [
      ["100%", 1], // only the one with a literal percent sign (common practice, no source)
      ["_a", 1], // only the one with a literal underscore
      ["frond", 4], // A–Z in either case
      ["VENTRAL", 2],
    ];
    for (const [text, n] of cases) {
      const rows = await sameAsSequelize(
        m.Study,
        {
          where: { labId: ctx.labId, [CONTAINS_TEXT]: { attributes: ["name", "tissue"], text } },
          order: [["name", "asc"]],
        },
        { labId: ctx.labId, [Op.or]: [{ name: containsText(text) }, { tissue: containsText(text) }] },
      );
      expect(rows, text).toHaveLength(n);
    }
  });

  it("refuses a clause it cannot write, instead of dropping it", async () => {
    const m = await database();
    await expect(readAll(m.Study, { where: { name: { [Op.like]: "%x%" } } as never })).rejects.toThrow(
      /operator .* is not supported/,
    );
    await expect(readAll(m.Study, { where: { nameOfNothing: "x" } })).rejects.toThrow(/no attribute nameOfNothing/);
  });
});
