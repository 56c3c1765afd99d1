/**
 * Replicates as biologists count them (SCIENCE.md §6): a fit from readouts averages the images of each
 * specimen first, counts a repeated file once, and by default adds the spread between specimens to each
 * datum's uncertainty. Hand-made design: 3 specimens × 2 images of one condition, plus the first image's
 * file read a second time. Expected values computed by hand (below; common practice, no source):
 *   S1 {40.0, 41.0} → mean 40.5, u = max(√(0.2²+0.2²)/2 = 0.1414, SD/√2 = 0.5) = 0.5
 *   S2 {42.0, 42.0} → 42.0, u = max(0.1414, 0) = 0.141421356
 *   S3 {39.0, 39.4} → 39.2, u = max(0.1414, 0.2) = 0.2
 *   SD between specimens of {40.5, 42.0, 39.2} = 1.401189970; u' = √(u² + SD²) = 1.487727574, 1.408308678, 1.415391583
 */
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import { cancelJob } from "@/lib/server/jobs/queue";
import { database } from "@/lib/server/services";
import { FITS, setupFitsLab } from "../support/fits";

const { lab } = setupFitsLab();

async function makeDesign() {
  const m = await database();
  const by = lab.w.people.manager.userId;
  const study = await m.Study.create({
    labId: lab.w.labId,
    name: "Replicates",
    tissue: "skin",
    organism: "chick",
    description: null,
    createdBy: by,
  });
  const readoutIds: string[] = [];
  const images: Record<string, number[]> = { S1: [40.0, 41.0], S2: [42.0, 42.0], S3: [39.0, 39.4] };
  let firstSha = "";
  for (const [label, values] of Object.entries(images)) {
    const specimen = await m.Specimen.create({
      labId: lab.w.labId,
      studyId: study.id,
      label,
      condition: "control",
      stage: null,
      genotype: null,
      notes: null,
      createdBy: by,
    });
    const add = async (wavelengthUm: number, sha: string) => {
      const upload = await m.Upload.create({
        id: randomUUID(),
        labId: lab.w.labId,
        specimenId: specimen.id,
        filename: `${label}-${readoutIds.length + 1}.tif`,
        storageKey: `test/${randomUUID()}`,
        sizeBytes: 1,
        sha256: sha,
        kind: "image",
        contentType: "image/tiff",
        pixelSizeUm: 1,
        pixelSizeSource: "uploader",
        createdBy: by,
      } as never);
      const wavelength = { wavelengthUm, uncertaintyUm: 0.2, periodFound: true, significance: 40, symmetry: "stripes" };
      const r = await m.Readout.create({
        labId: lab.w.labId,
        uploadId: upload.id,
        specimenId: specimen.id,
        jobId: null,
        status: "succeeded",
        kind: "image",
        settings: {},
        result: { type: "image", wavelength } as never,
        wavelengthUm,
        uncertaintyUm: 0.2,
        periodFound: true,
        pixelSizeUm: 1,
        inputSha256: sha,
        softwareVersion: "morphokin test",
        createdBy: by,
      });
      readoutIds.push(r.id);
    };
    for (const v of values) {
      const sha = randomUUID().replace(/-/g, "").padEnd(64, "0");
      if (!firstSha) firstSha = sha;
      await add(v, sha);
    }
    // The first image's file read again for the same specimen: one measurement, not two.
    if (label === "S1") await add(40.0, firstSha);
  }
  return readoutIds;
}

const body = (readoutIds: string[], extra: Record<string, unknown> = {}) => ({
  name: "Replicates",
  data: readoutIds.map((readoutId) => ({ readoutId })),
  models: [
    {
      kinetics: "schnakenberg",
      lengthScaleUm: 40,
      parameters: { gamma: { mode: "free", start: 100, lower: 10, upper: 1000, log: true } },
    },
  ],
  options: { profiles: false },
  ...extra,
});

async function startSpec(json: unknown): Promise<FitDetailDto> {
  const res = await lab.api("POST", FITS, { json });
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  const fit = res.body as FitDetailDto;
  await cancelJob(lab.w.labId, fit.jobId!).catch(() => undefined); // the spec is what is checked here
  return fit;
}

describe("a fit counts specimens, not images", () => {
  it("averages each specimen's images, counts a repeated file once and adds the between-specimen spread", async () => {
    const ids = await makeDesign();
    const fit = await startSpec(body(ids));
    expect(fit.spec.data.map((d) => Number(d.wavelengthUm.toFixed(9)))).toEqual([40.5, 42, 39.2]);
    expect(fit.spec.data.map((d) => Number(d.uncertaintyUm.toFixed(9)))).toEqual([
      1.487727574, 1.408308678, 1.415391583,
    ]);
    expect(fit.provenance.settings.replicates).toBe("specimens");
    expect(fit.provenance.settings.uncertainty).toBe("with-specimen-spread");
    expect(fit.provenance.settings.replicateCounts).toBe("3 specimens · 6 images · 1 repeated file counted once");
    // Every readout stays in the provenance; the repeated one feeds no datum and says why.
    expect(fit.provenance.data).toHaveLength(7);
    expect(fit.provenance.data.map((d) => d.datumIndex)).toEqual(
      [0, 0, 0, 1, 1, 2, 2].map((x, i) => (i === 2 ? null : x)),
    );
    expect(fit.provenance.data[2].note).toMatch(/same file/);
  });

  it("counting every image is a choice; the readouts' own uncertainties are another", async () => {
    const ids = await makeDesign();
    const fit = await startSpec(body(ids, { replicates: "images", uncertainty: "per-readout" }));
    expect(fit.spec.data.map((d) => d.wavelengthUm)).toEqual([40, 41, 40, 42, 42, 39, 39.4]);
    expect(fit.spec.data.every((d) => d.uncertaintyUm === 0.2)).toBe(true);
    const bad = await lab.api("POST", FITS, { json: body(ids, { replicates: "embryos" }) });
    expect(bad.status).toBe(400);
    expect((bad.body as { error: { message: string } }).error.message).toBe(
      'Replicates must be "specimens" or "images"',
    );
  });
});
