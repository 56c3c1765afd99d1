/**
 * Rows for search tests, written straight to the tables (no jobs, no stored bytes): search reads
 * only names and a few facts, and a test that waited for readouts and fits would test those instead.
 */
import { randomUUID } from "node:crypto";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { database } from "@/lib/server/services";
import type { LabContext } from "@/lib/server/access";

const HASH = "0".repeat(64);

export async function seedStudy(ctx: LabContext, name: string) {
  return createStudy(ctx, { name, tissue: "dorsal skin", organism: "chick", description: null });
}

export async function seedSpecimen(
  ctx: LabContext,
  studyId: string,
  s: { label: string; condition: string; stage?: string | null; genotype?: string | null },
) {
  return createSpecimen(ctx, studyId, { stage: null, genotype: null, notes: null, ...s });
}

export async function seedUpload(ctx: LabContext, specimenId: string, filename: string) {
  const m = await database();
  const id = randomUUID();
  return m.Upload.create({
    id,
    labId: ctx.labId,
    specimenId,
    filename,
    kind: "image",
    contentType: "image/png",
    sizeBytes: 10,
    sha256: HASH,
    storageKey: `labs/${ctx.labId}/search-test/${id}`,
    state: "stored",
    pixelSizeUm: 1,
    pixelSizeSource: "uploader",
    createdBy: ctx.actor.userId,
  });
}

export async function seedReadout(ctx: LabContext, upload: { id: string; specimenId: string }, wavelengthUm: number) {
  const m = await database();
  return m.Readout.create({
    labId: ctx.labId,
    uploadId: upload.id,
    specimenId: upload.specimenId,
    jobId: null,
    status: "succeeded",
    kind: "image",
    settings: {},
    wavelengthUm,
    uncertaintyUm: 0.5,
    periodFound: true,
    pixelSizeUm: 1,
    inputSha256: HASH,
    softwareVersion: "test",
    createdBy: ctx.actor.userId,
  });
}

export async function seedFit(ctx: LabContext, name: string, kinetics: { kind: "catalogue" | "lab"; id: string }) {
  const m = await database();
  return m.Fit.create({
    labId: ctx.labId,
    name,
    kind: "fit",
    status: "succeeded",
    jobId: null,
    spec: {},
    provenance: { kinetics: [{ ...kinetics, label: kinetics.id, version: null }] },
    inputSha256: HASH,
    softwareVersion: "test",
    rerunOf: null,
    createdBy: ctx.actor.userId,
  });
}

export async function seedRun(ctx: LabContext, name: string, kineticsName: string) {
  const m = await database();
  return m.SimulationRun.create({
    labId: ctx.labId,
    jobId: null,
    status: "running",
    name,
    kineticsKind: "catalogue",
    kineticsRef: "schnakenberg",
    kineticsVersion: null,
    kineticsName,
    spec: {},
    plan: {},
    seed: "1",
    predictedWavelengthUm: null,
    softwareVersion: "test",
    createdBy: ctx.actor.userId,
  });
}

export async function seedThread(ctx: LabContext, target: { type: string; id: string }, body: string) {
  const m = await database();
  const thread = await m.CommentThread.create({
    labId: ctx.labId,
    targetType: target.type,
    targetId: target.id,
    createdBy: ctx.actor.userId,
    lastActivityAt: new Date(),
  });
  await m.Comment.create({
    labId: ctx.labId,
    threadId: thread.id,
    parentId: null,
    authorId: ctx.actor.userId,
    body,
    bodyHtml: `<p>${body}</p>`,
    mentions: [],
  });
  return thread;
}
