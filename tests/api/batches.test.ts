/**
 * Batches through the API: start a batch into a study (a specimen per file) or into a specimen,
 * send its files one per request, read its summary (JSON and CSV). One bad file fails alone and
 * leaves nothing behind; the batch's pixel size fills in for files without their own.
 */
import { describe, expect, it } from "vitest";
import { encodePng, encodeTiff16 } from "@/lib/imaging";
import { makeHexSpots, makeStripes } from "@/lib/synthetic";
import { createStudy } from "@/lib/server/studies/studies";
import { waitForJob } from "@/lib/server/jobs/queue";
import { database } from "@/lib/server/services";
import type { BatchSummary } from "@/lib/server/batches/summary";
import { multipart } from "../support/api";
import { setupLabApi } from "../support/lab-api";

const lab = setupLabApi({ who: "scientist" });

/** Not an image nor a table: a PDF header followed by binary bytes (judged by content). */
const NOT_AN_IMAGE = new Uint8Array([...Buffer.from("%PDF-1.4\n"), 0, 1, 2, 3, 0, 0, 255]);

async function newStudy(name: string) {
  return createStudy(lab.ctx("scientist"), { name, tissue: "dorsal skin", organism: "chick", description: null });
}

async function sendFile(batchId: string, name: string, bytes: Uint8Array, fields: Record<string, string> = {}) {
  return lab.api("POST", "/api/v1/labs/[labId]/batches/[batchId]/uploads", {
    params: { batchId },
    body: multipart({ name, bytes }, fields),
  });
}

async function summaryWhenDone(batchId: string): Promise<BatchSummary> {
  const m = await database();
  const uploads = await m.Upload.findAll({ where: { batchId } });
  const readouts = await m.Readout.findAll({ where: { uploadId: uploads.map((u) => u.id) } });
  for (const r of readouts) if (r.jobId) await waitForJob(r.jobId, 60_000);
  const res = await lab.api("GET", "/api/v1/labs/[labId]/batches/[batchId]", { params: { batchId } });
  expect(res.status).toBe(200);
  return res.body as BatchSummary;
}

describe("batches", () => {
  it("a study batch makes a specimen per file; the file that is not an image fails alone, leaving nothing", async () => {
    const study = await newStudy("Batch study");
    const created = await lab.api("POST", "/api/v1/labs/[labId]/batches", {
      json: { target: "specimen-per-file", studyId: study.id, condition: "control", stage: "E7", pixelSizeUm: 0.5 },
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ target: "specimen-per-file", studyId: study.id, pixelSizeUm: 0.5 });
    const batchId = created.body.id as string;

    // Stripes of period 16 px and hexagonal spots of lattice spacing 24 px (Fourier wavelength
    // (√3/2)·24 px, SCIENCE.md §5) at 0.5 µm/px: λ = 8 µm and 10.39 µm by construction.
    const stripes = await encodePng(
      makeStripes({ width: 192, height: 160, wavelengthPx: 16, angleDeg: 30, noise: 0.1, seed: 11 }),
    );
    const spots = await encodePng(
      makeHexSpots({ width: 256, height: 256, spacingPx: 24, angleDeg: 8, spotRadiusPx: 6, noise: 0.05, seed: 3 }),
    );
    const a = await sendFile(batchId, "stripes-a.png", stripes);
    const bad = await sendFile(batchId, "notes.pdf", NOT_AN_IMAGE);
    const b = await sendFile(batchId, "spots-b.png", spots);
    expect(a.status).toBe(201);
    expect(b.status).toBe(201);
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toContain("“notes.pdf” is not a PNG, JPEG or TIFF image");
    expect(a.body).toMatchObject({ batchId, specimenLabel: "stripes-a", pixelSizeUm: 0.5 });

    // Nothing half-written: no upload row (not even "receiving") and no specimen for the bad file.
    const m = await database();
    expect(await m.Upload.unscoped().count({ where: { filename: "notes.pdf" } })).toBe(0);
    const specimens = await m.Specimen.findAll({ where: { studyId: study.id }, order: [["label", "asc"]] });
    expect(specimens.map((s) => [s.label, s.condition, s.stage])).toEqual([
      ["spots-b", "control", "E7"],
      ["stripes-a", "control", "E7"],
    ]);

    const s = await summaryWhenDone(batchId);
    expect(s.done).toBe(true);
    expect(s.rows.map((r) => [r.filename, r.status])).toEqual([
      ["stripes-a.png", "read"],
      ["spots-b.png", "read"],
      ["notes.pdf", "failed"],
    ]);
    expect(s.rows[0].wavelengthUm!).toBeWithinRelative(8, 0.01);
    expect(s.rows[0].symmetry).toBe("stripes");
    expect(s.rows[1].wavelengthUm!).toBeWithinRelative((Math.sqrt(3) / 2) * 24 * 0.5, 0.02);
    expect(s.rows[1].symmetry).toBe("hexagonal");
    expect(s.rows[2].statusText).toMatch(/^failed: “notes\.pdf” is not a PNG/);
    expect(s.counts).toMatchObject({ read: 2, failed: 1, queued: 0, reading: 0 });

    const csv = await lab.api("GET", "/api/v1/labs/[labId]/batches/[batchId]/csv", { params: { batchId } });
    expect(csv.status).toBe(200);
    const lines = (await csv.res.text()).trim().split("\n");
    expect(lines[1]).toBe(
      "file,specimen,wavelength_um,uncertainty_um,symmetry,significance,status,message,measure,pixel_size_um_per_px,upload_id,readout_id",
    );
    expect(lines.slice(2).map((l) => l.split(",")[0])).toEqual(["stripes-a.png", "spots-b.png", "notes.pdf"]);
  }, 120_000);

  it("a specimen batch puts every file on that specimen; a file's own pixel size wins unless overridden", async () => {
    const study = await newStudy("Specimen batch study");
    const m = await database();
    const sp = await m.Specimen.create({
      labId: lab.w.labId,
      studyId: study.id,
      label: "E1",
      condition: "control",
      stage: null,
      genotype: null,
      notes: null,
      createdBy: lab.w.people.scientist.userId,
    });
    // A TIFF with its own resolution tags: 2 µm/px in the file itself.
    const own = await encodeTiff16(makeStripes({ width: 128, height: 128, wavelengthPx: 16, angleDeg: 0, seed: 5 }), {
      pixelSizeUm: 2,
    });
    const plain = await encodePng(makeStripes({ width: 128, height: 128, wavelengthPx: 16, angleDeg: 0, seed: 6 }));
    const start = async (override: boolean) =>
      (
        await lab.api("POST", "/api/v1/labs/[labId]/batches", {
          json: { target: "specimen", specimenId: sp.id, pixelSizeUm: 0.5, pixelSizeOverride: override },
        })
      ).body.id as string;
    const keep = await start(false);
    const withOwn = await sendFile(keep, "own.tif", own);
    const withoutOwn = await sendFile(keep, "plain.png", plain);
    expect([withOwn.body.pixelSizeUm, withoutOwn.body.pixelSizeUm]).toEqual([2, 0.5]);
    expect(withOwn.body.specimenId).toBe(sp.id);
    const forced = await start(true);
    expect((await sendFile(forced, "own.tif", own)).body).toMatchObject({
      pixelSizeUm: 0.5,
      pixelSizeSource: "uploader",
    });
    expect(await m.Upload.count({ where: { specimenId: sp.id } })).toBe(3);
  }, 60_000);

  it("bad input names the field; another member cannot add to someone's batch; another lab's batch is not found", async () => {
    const missing = await lab.api("POST", "/api/v1/labs/[labId]/batches", {
      json: { target: "specimen-per-file", condition: "control" },
    });
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toContain("Study: choose the study");
    const study = await newStudy("Owner study");
    const mine = await lab.api("POST", "/api/v1/labs/[labId]/batches", {
      json: { target: "one-specimen", studyId: study.id, condition: "treated", specimenLabel: "E9", pixelSizeUm: 1 },
    });
    expect(mine.status).toBe(201);
    expect(mine.body.specimenLabel).toBe("E9");
    const png = await encodePng(makeStripes({ width: 64, height: 64, wavelengthPx: 8, angleDeg: 0, seed: 1 }));
    const other = await lab.api("POST", "/api/v1/labs/[labId]/batches/[batchId]/uploads", {
      who: "modeller",
      params: { batchId: mine.body.id },
      body: multipart({ name: "x.png", bytes: png }),
    });
    expect(other.status).toBe(403);
    const outsider = await lab.api("GET", "/api/v1/labs/[labId]/batches/[batchId]", {
      who: lab.w.outsider,
      params: { batchId: mine.body.id },
    });
    expect(outsider.status).toBe(404);
    const list = await lab.api("GET", "/api/v1/labs/[labId]/batches", { query: "sort=createdAt&dir=desc" });
    expect(list.body.items.map((b: { id: string }) => b.id)).toContain(mine.body.id);
  });
});
