/**
 * Provenance that holds: an upload whose readout a fit used, and lab kinetics a fit used, cannot be
 * deleted; the refusal names the fit, nothing is removed, and the fit's sources still open. Unused ones
 * delete as before.
 */
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import { cancelJob } from "@/lib/server/jobs/queue";
import { database } from "@/lib/server/services";
import { FITS, setupFitsLab } from "../support/fits";
import { labSchnakenberg } from "./permission-cases/kinetics";

const { lab } = setupFitsLab();
const UPLOAD = "/api/v1/labs/[labId]/uploads/[uploadId]";
const KINETICS = "/api/v1/labs/[labId]/kinetics";
const ONE_KINETICS = `${KINETICS}/[kineticsId]`;

async function makeReadout(filename: string) {
  const m = await database();
  const by = lab.w.people.manager.userId;
  const study = await m.Study.create({
    labId: lab.w.labId,
    name: `Study ${filename}`,
    tissue: "skin",
    organism: "chick",
    description: null,
    createdBy: by,
  });
  const specimen = await m.Specimen.create({
    labId: lab.w.labId,
    studyId: study.id,
    label: "E1",
    condition: "control",
    stage: null,
    genotype: null,
    notes: null,
    createdBy: by,
  });
  const upload = await m.Upload.create({
    id: randomUUID(),
    labId: lab.w.labId,
    specimenId: specimen.id,
    filename,
    storageKey: `test/${randomUUID()}`,
    sizeBytes: 1,
    sha256: "c".repeat(64),
    kind: "image",
    contentType: "image/tiff",
    pixelSizeUm: 1,
    pixelSizeSource: "uploader",
    createdBy: by,
  } as never);
  const wavelength = { wavelengthUm: 40, uncertaintyUm: 0.4, periodFound: true, significance: 40, symmetry: "stripes" };
  const readout = await m.Readout.create({
    labId: lab.w.labId,
    uploadId: upload.id,
    specimenId: specimen.id,
    jobId: null,
    status: "succeeded",
    kind: "image",
    settings: {},
    result: { type: "image", wavelength } as never,
    wavelengthUm: 40,
    uncertaintyUm: 0.4,
    periodFound: true,
    pixelSizeUm: 1,
    inputSha256: "c".repeat(64),
    softwareVersion: "morphokin test",
    createdBy: by,
  });
  return { upload, readout };
}

async function startFit(name: string, data: unknown[], kinetics = "schnakenberg"): Promise<FitDetailDto> {
  const res = await lab.api("POST", FITS, {
    json: {
      name,
      data,
      models: [{ kinetics, lengthScaleUm: 40, parameters: { a: { mode: "free", start: 0.1, lower: 0.01, upper: 1 } } }],
      options: { profiles: false },
    },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  await cancelJob(lab.w.labId, res.body.jobId).catch(() => undefined); // the fit's row and provenance are what count
  return res.body as FitDetailDto;
}

describe("what a result used cannot vanish", () => {
  it("an upload whose readout a fit used is kept, with the fit named; an unused one deletes", async () => {
    const used = await makeReadout("used.tif");
    await startFit("Uses the readout", [
      { readoutId: used.readout.id },
      { condition: "control", kind: "fourier", wavelengthUm: 41, uncertaintyUm: 0.5 },
    ]);
    const refused = await lab.api("DELETE", UPLOAD, { who: "manager", params: { uploadId: used.upload.id } });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe(
      "“used.tif” cannot be deleted: its readouts are used by 1 fit (“Uses the readout”). Results keep their sources, so they can be checked and re-run; delete those results first if they are no longer needed.",
    );
    const m = await database();
    expect(await m.Upload.count({ where: { id: used.upload.id } })).toBe(1);
    expect(await m.Readout.count({ where: { id: used.readout.id } })).toBe(1);
    // The audit trail records the refusal, with what depends on the upload.
    const refusal = await m.AuditEvent.findOne({
      where: { targetId: used.upload.id, action: "upload.delete-refused" },
    });
    expect(refusal!.summary).toContain("tried to delete the upload “used.tif”; kept, because 1 result(s) used it");
    expect((refusal!.details as { dependents: { name: string }[] }).dependents.map((d) => d.name)).toEqual([
      "Uses the readout",
    ]);
    const unused = await makeReadout("unused.tif");
    expect((await lab.api("DELETE", UPLOAD, { who: "manager", params: { uploadId: unused.upload.id } })).status).toBe(
      204,
    );
  });

  it("lab kinetics a fit used is kept with its versions; unused lab kinetics deletes", async () => {
    const created = await lab.api("POST", KINETICS, { json: { definition: labSchnakenberg("Lab Schnakenberg") } });
    expect(created.status).toBe(201);
    await startFit(
      "Uses lab kinetics",
      [
        { condition: "control", kind: "fourier", wavelengthUm: 40, uncertaintyUm: 0.5 },
        { condition: "control", kind: "fourier", wavelengthUm: 41, uncertaintyUm: 0.5 },
      ],
      created.body.id,
    );
    const refused = await lab.api("DELETE", ONE_KINETICS, { params: { kineticsId: created.body.id } });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(
      /^The kinetics “Lab Schnakenberg” cannot be deleted: its versions are used by 1 fit \(“Uses lab kinetics”\)/,
    );
    const m = await database();
    expect(await m.KineticsVersion.count({ where: { kineticsId: created.body.id } })).toBe(1);
    expect(await m.AuditEvent.count({ where: { targetId: created.body.id, action: "kinetics.delete-refused" } })).toBe(
      1,
    );
    const spare = await lab.api("POST", KINETICS, { json: { definition: labSchnakenberg("Spare") } });
    expect((await lab.api("DELETE", ONE_KINETICS, { params: { kineticsId: spare.body.id } })).status).toBe(204);
  });
});
