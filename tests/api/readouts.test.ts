/**
 * Spacing readouts through the API: an upload starts its readout job, the job's numbers match the
 * generated pattern, tables give hand-computed statistics, re-runs make new readouts, bad input
 * fails with a reason while the upload stays, deleting the upload removes readouts and derived
 * objects, and the study's condition comparison (JSON and CSV) gives Welch's test.
 */
import { createHash } from "node:crypto";
import { crc32 } from "node:zlib";
import Papa from "papaparse";
import sharp from "sharp";
import { jStat } from "jstat";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import packageJson from "@/package.json";
import { encodePng } from "@/lib/imaging";
import { READOUT_MESSAGES } from "@/lib/readout";
import { makeHexSpots, makeStripes } from "@/lib/synthetic";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import type { ReadoutDetailDto, ReadoutDto } from "@/lib/server/readouts/readouts";
import type { ConditionComparison } from "@/lib/server/readouts/comparison";
import { waitForJob } from "@/lib/server/jobs/queue";
import { database, services } from "@/lib/server/services";
import { call, discoverRoutes, multipart } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
let studyId: string;

const sha256 = (b: Uint8Array) => createHash("sha256").update(b).digest("hex");
const ctxOf = () => ({
  actor: w.people.scientist.actor,
  labId: w.labId,
  labName: "Test Lab",
  role: "scientist" as const,
});
const api = (
  key: string,
  params: Record<string, string>,
  extra: { json?: unknown; body?: BodyInit; query?: string } = {},
) => {
  const [method, path] = key.split(" ") as ["GET" | "POST" | "DELETE", string];
  return call(routes.get(key)!, method, path, {
    token: w.people.scientist.token,
    params: { labId: w.labId, ...params },
    ...extra,
  });
};
const errorOf = async (res: Response) => ((await res.json()) as { error: { code: string; message: string } }).error;

async function newSpecimen(condition = "control") {
  return createSpecimen(ctxOf(), studyId, {
    label: `S-${Math.random().toString(36).slice(2, 7)}`,
    condition,
    stage: null,
    genotype: null,
    notes: null,
  });
}

/** Uploads through the route; returns the upload with the readout it started. */
async function uploadFile(specimenId: string, name: string, bytes: Uint8Array, fields: Record<string, string> = {}) {
  const res = await api(
    "POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads",
    { specimenId },
    { body: multipart({ name, bytes }, fields) },
  );
  return {
    status: res.status,
    body: (await res.json()) as {
      id: string;
      readout: ReadoutDto | null;
      readoutError: string | null;
      error?: { message: string };
    },
  };
}

async function finished(readout: ReadoutDto | null): Promise<ReadoutDetailDto> {
  expect(readout).not.toBeNull();
  await waitForJob(readout!.jobId!, 30_000);
  const res = await api("GET /api/v1/labs/[labId]/readouts/[readoutId]", { readoutId: readout!.id });
  expect(res.status).toBe(200);
  return (await res.json()) as ReadoutDetailDto;
}

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
  studyId = (
    await createStudy(ctxOf(), { name: "Readout study", tissue: "skin", organism: "chick", description: null })
  ).id;
});
afterAll(async () => stack?.close());

describe("image readouts", () => {
  let stripes: { uploadId: string; first: ReadoutDetailDto; bytes: Uint8Array };

  it("an upload starts a readout whose wavelength matches the generated stripes within 1 %", async () => {
    // Geometry is the source: stripes of period 16 px at 0.5 µm/px have λ = 8 µm.
    const bytes = await encodePng(
      makeStripes({ width: 192, height: 160, wavelengthPx: 16, angleDeg: 30, noise: 0.1, seed: 11 }),
    );
    const sp = await newSpecimen();
    const up = await uploadFile(sp.id, "stripes.png", bytes, { pixelSizeUm: "0.5" });
    expect(up.status).toBe(201);
    expect(up.body.readout).toMatchObject({
      status: "queued",
      kind: "image",
      uploadId: up.body.id,
      inputSha256: sha256(bytes),
      softwareVersion: `morphokin ${packageJson.version}`,
      pixelSizeUm: 0.5,
      pixelSizeSource: "uploader",
    });
    const r = await finished(up.body.readout);
    expect(r.status).toBe("succeeded");
    expect(r.progress).toBe(1);
    expect(r.headline!.periodFound).toBe(true);
    expect(Math.abs(r.headline!.wavelengthUm! - 8) / 8).toBeLessThan(0.01);
    if (r.result?.type !== "image") throw new Error("expected an image readout");
    expect(r.result.wavelength.symmetry).toBe("stripes");
    expect(Math.abs(r.result.wavelength.wavelengthPx! - 16) / 16).toBeLessThan(0.01);
    expect(r.result.wavelength.uncertaintyMethod).not.toBeNull();
    // Wave vector perpendicular to the stripes at 30° (geometry); a few degrees of slack for noise.
    expect(Math.abs(r.result.wavelength.orientationDeg! - 30)).toBeLessThan(3);
    expect(r.result.pixelSizeSource).toBe("uploader");
    expect(Object.keys(r.derived).sort()).toEqual(["fft.png", "preview.png", "spectrum.json"]);
    stripes = { uploadId: up.body.id, first: r, bytes };
  });

  it("serves the derived products: a preview of the whole image, the FFT image and the spectrum", async () => {
    const get = (product: string) =>
      api("GET /api/v1/labs/[labId]/readouts/[readoutId]/derived/[product]", { readoutId: stripes.first.id, product });
    const preview = await get("preview.png");
    expect(preview.headers.get("content-type")).toBe("image/png");
    const meta = await sharp(Buffer.from(await preview.arrayBuffer())).metadata();
    expect([meta.width, meta.height]).toEqual([192, 160]); // the source size (under the 1024 px cap)
    const fft = await get("fft.png");
    // Cropped to ± 3 × the peak frequency of the 256-point padded transform: 2 · round(3/16 · 256) = 96 px.
    expect((await sharp(Buffer.from(await fft.arrayBuffer())).metadata()).width).toBe(96);
    const fftInfo = (stripes.first.result as { fft?: { ringFraction: number | null } }).fft;
    expect(fftInfo?.ringFraction).toBeCloseTo(1 / 3, 2); // the ring at 1/λ, a third of the way to the edge
    const spectrum = await (await get("spectrum.json")).json();
    expect(spectrum.radialSpectrum.frequencyPerUm.length).toBe(spectrum.radialSpectrum.power.length);
    expect(spectrum.angularPower).toHaveLength(180);
    expect(spectrum.localWavelength.profile.axis).toBe("x");
    expect((await get("other.png")).status).toBe(404);
    expect((await get("toString")).status).toBe(404);
  });

  it("re-running with an ROI makes a second readout and keeps the first unchanged", async () => {
    const roi = { kind: "rect", x: 0, y: 0, width: 128, height: 128 };
    const res = await api(
      "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts",
      { uploadId: stripes.uploadId },
      { json: { roi, flatten: "none", window: "tukey", profileAxis: "y" } },
    );
    expect(res.status).toBe(202);
    const second = await finished((await res.json()) as ReadoutDto);
    expect(second.id).not.toBe(stripes.first.id);
    expect(second.settings).toMatchObject({ kind: "image", roi, flatten: "none", window: "tukey", profileAxis: "y" });
    expect(Math.abs(second.headline!.wavelengthUm! - 8) / 8).toBeLessThan(0.01);
    const list = await (
      await api("GET /api/v1/labs/[labId]/uploads/[uploadId]/readouts", { uploadId: stripes.uploadId })
    ).json();
    expect(list.total).toBe(2);
    const again = (await (
      await api("GET /api/v1/labs/[labId]/readouts/[readoutId]", { readoutId: stripes.first.id })
    ).json()) as ReadoutDetailDto;
    expect(again.settings).toEqual(stripes.first.settings);
    expect(again.headline).toEqual(stripes.first.headline);
  });

  it("hexagonal spots report the Fourier wavelength and the nearest-neighbour spacing, a = (2/√3)·λ", async () => {
    // Generated lattice spacing a = 24 px at 1 µm/px: λ = (√3/2)·24 = 20.785 µm (SCIENCE.md §4).
    const bytes = await encodePng(
      makeHexSpots({ width: 256, height: 256, spacingPx: 24, angleDeg: 8, spotRadiusPx: 6, noise: 0.05, seed: 3 }),
    );
    const up = await uploadFile((await newSpecimen()).id, "spots.png", bytes, { pixelSizeUm: "1" });
    const r = await finished(up.body.readout);
    expect(r.headline!.symmetry).toBe("hexagonal");
    expect(Math.abs(r.headline!.wavelengthUm! - (Math.sqrt(3) / 2) * 24) / 20.785).toBeLessThan(0.01);
    expect(Math.abs(r.headline!.nearestNeighbourUm! - 24) / 24).toBeLessThan(0.01);
  });

  it("deleting the upload removes its readouts and every derived object", async () => {
    const m = await database();
    const rows = await m.Readout.findAll({ where: { uploadId: stripes.uploadId } });
    const keys = rows.flatMap((r) => Object.values(r.derivedKeys ?? {}));
    expect(keys).toHaveLength(6);
    for (const k of keys) expect(await services().store.exists(k)).toBe(true);
    expect((await api("DELETE /api/v1/labs/[labId]/uploads/[uploadId]", { uploadId: stripes.uploadId })).status).toBe(
      204,
    );
    expect(await m.Readout.count({ where: { uploadId: stripes.uploadId } })).toBe(0);
    for (const k of keys) expect(await services().store.exists(k)).toBe(false);
    expect((await api("GET /api/v1/labs/[labId]/readouts/[readoutId]", { readoutId: stripes.first.id })).status).toBe(
      404,
    );
  });
});

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
      "Could not tell from the header which columns to read (the columns are: a, b); start a readout with a column mapping: x and y, or position, or spacing.",
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

describe("bad input", () => {
  it("a truncated PNG is kept as an upload; its readout fails and says why, with no result or derived objects", async () => {
    const good = await encodePng(
      makeStripes({ width: 128, height: 128, wavelengthPx: 10, angleDeg: 0, noise: 0.3, seed: 2 }),
    );
    const bytes = good.subarray(0, Math.floor(good.length * 0.6));
    const up = await uploadFile((await newSpecimen()).id, "cut.png", bytes, { pixelSizeUm: "1" });
    expect(up.status).toBe(201);
    const r = await finished(up.body.readout);
    expect(r.status).toBe("failed");
    expect(r.error).toMatch(/^The PNG file could not be decoded; it may be truncated or damaged/);
    expect(r.result).toBeNull();
    expect(r.derived).toEqual({});
    const m = await database();
    expect((await m.Readout.findByPk(r.id))!.derivedKeys).toBeNull();
    expect((await api("GET /api/v1/labs/[labId]/uploads/[uploadId]", { uploadId: up.body.id })).status).toBe(200);
    expect((await waitForJob(r.jobId!)).error).toBe(r.error);
  });

  it("an image without variation fails with the reason", async () => {
    const flat = await sharp({ create: { width: 64, height: 64, channels: 3, background: { r: 120, g: 120, b: 120 } } })
      .greyscale()
      .png()
      .toBuffer();
    const up = await uploadFile((await newSpecimen()).id, "flat.png", flat, { pixelSizeUm: "1" });
    const r = await finished(up.body.readout);
    expect(r).toMatchObject({ status: "failed", error: READOUT_MESSAGES.noVariation });
  });

  it("a zero-area ROI, a field for the other kind, and a table in px without pixel size are refused at once", async () => {
    const bytes = await encodePng(makeStripes({ width: 64, height: 64, wavelengthPx: 8, angleDeg: 0, seed: 1 }));
    const img = await uploadFile((await newSpecimen()).id, "small.png", bytes, { pixelSizeUm: "1" });
    const start = (uploadId: string, json: unknown) =>
      api("POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts", { uploadId }, { json });
    const zero = await start(img.body.id, { roi: { kind: "rect", x: 5, y: 5, width: 0, height: 20 } });
    expect(zero.status).toBe(422);
    expect((await errorOf(zero)).message).toBe(READOUT_MESSAGES.zeroAreaRoi);
    const line = await start(img.body.id, {
      roi: {
        kind: "polygon",
        points: [
          [0, 0],
          [10, 10],
          [20, 20],
        ],
      },
    });
    expect(line.status).toBe(422);
    const wrong = await start(img.body.id, { columns: { spacing: "a" } });
    expect(wrong.status).toBe(400);
    expect((await errorOf(wrong)).message).toContain("columns");
    const table = await uploadFile(
      (await newSpecimen()).id,
      "px.csv",
      new TextEncoder().encode("spacing_px\n10\n12\n"),
    );
    const px = await start(table.body.id, { columns: { spacing: "spacing_px" }, unit: "px" });
    expect(px.status).toBe(422);
    expect((await errorOf(px)).message).toBe(
      'The table is in pixels (unit "px") but no pixel size is known: give the pixel size in µm/px.',
    );
    const m = await database();
    expect(await m.Readout.count({ where: { uploadId: img.body.id } })).toBe(1); // only the upload's own
  });

  it("an image above the pixel limit is refused at upload from its header (413)", async () => {
    // A 1×1 PNG whose IHDR claims 9000×8000 (CRC recomputed): only the header is ever read.
    const big = Buffer.from(
      await sharp({ create: { width: 1, height: 1, channels: 3, background: { r: 0, g: 0, b: 0 } } })
        .png()
        .toBuffer(),
    );
    big.writeUInt32BE(9000, 16);
    big.writeUInt32BE(8000, 20);
    big.writeUInt32BE(crc32(big.subarray(12, 29)), 29);
    const up = await uploadFile((await newSpecimen()).id, "huge.png", big, { pixelSizeUm: "1" });
    expect(up.status).toBe(413);
    expect(up.body.error!.message).toBe(
      "“huge.png” is 9000×8000 = 72000000 pixels, above the limit of 67108864 pixels (8192×8192); crop or bin it before uploading",
    );
  });
});

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
