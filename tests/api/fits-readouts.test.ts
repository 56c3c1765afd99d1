/**
 * Fits through the API with readouts as data: a readout's nearest-neighbour spacing is converted
 * and said so, and the readout is recorded.
 */
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { database } from "@/lib/server/services";
import { lambdaUm, setupFitsLab } from "../support/fits";

const { lab, startAndWait } = setupFitsLab();

describe("readouts as data", () => {
  it("takes a readout's nearest-neighbour spacing, converts it and says so, and records the readout", async () => {
    const m = await database();
    const study = await m.Study.create({
      labId: lab.w.labId,
      name: "Placodes",
      tissue: "skin",
      organism: "chick",
      description: null,
      createdBy: lab.w.people.manager.userId,
    });
    const specimen = await m.Specimen.create({
      labId: lab.w.labId,
      studyId: study.id,
      label: "DS-9",
      condition: "control",
      stage: null,
      genotype: null,
      notes: null,
      createdBy: lab.w.people.manager.userId,
    });
    const upload = await m.Upload.create({
      id: randomUUID(),
      labId: lab.w.labId,
      specimenId: specimen.id,
      filename: "spots.tif",
      storageKey: `test/${specimen.id}`,
      sizeBytes: 1,
      sha256: "a".repeat(64),
      kind: "image",
      contentType: "image/tiff",
      pixelSizeUm: 2,
      pixelSizeSource: "uploader",
      createdBy: lab.w.people.manager.userId,
    } as never);
    // A finished readout of hexagonal spots: λ = 38.6 µm, a = (2/√3)·λ (SCIENCE.md §4).
    const lambda = lambdaUm({ gamma: 180 });
    const wavelength = {
      wavelengthUm: lambda,
      uncertaintyUm: 0.5,
      periodFound: true,
      significance: 40,
      symmetry: "hexagonal",
      nearestNeighbourUm: (2 / Math.sqrt(3)) * lambda,
    };
    const readout = await m.Readout.create({
      labId: lab.w.labId,
      uploadId: upload.id,
      specimenId: specimen.id,
      jobId: null,
      status: "succeeded",
      kind: "image",
      settings: {},
      result: { type: "image", wavelength } as never,
      wavelengthUm: lambda,
      uncertaintyUm: 0.5,
      periodFound: true,
      pixelSizeUm: 2,
      inputSha256: "b".repeat(64),
      softwareVersion: "morphokin test",
      createdBy: lab.w.people.manager.userId,
    });
    const fit = await startAndWait({
      name: "From a readout",
      data: [
        { readoutId: readout.id, kind: "nearest-neighbour" },
        {
          condition: "control",
          kind: "nearest-neighbour",
          wavelengthUm: (2 / Math.sqrt(3)) * lambda * 1.01,
          uncertaintyUm: 0.6,
        },
      ],
      models: [
        {
          kinetics: "schnakenberg",
          lengthScaleUm: 40,
          parameters: { gamma: { mode: "free", start: 100, lower: 10, upper: 1000, log: true } },
        },
      ],
    });
    const f = fit.result!.models[0].fit;
    expect(f.notes.join(" ")).toMatch(/converted to Fourier wavelengths as λ = \(√3\/2\)·a/);
    expect(f.residuals[0].measuredFourierUm).toBeCloseTo(lambda, 6);
    expect(f.parameters[0].interval95!.lower.value!).toBeLessThan(180);
    expect(f.parameters[0].interval95!.upper.value!).toBeGreaterThan(180);
    expect(fit.provenance.data[0]).toMatchObject({
      source: "readout",
      readoutId: readout.id,
      condition: "control",
      kind: "nearest-neighbour",
      inputSha256: "b".repeat(64),
      filename: "spots.tif",
      specimenLabel: "DS-9",
      studyName: "Placodes",
    });
  });
});
