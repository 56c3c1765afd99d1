/** Batch routes: list, start, one file into a batch, the summary (JSON, CSV). */
import { database } from "@/lib/server/services";
import { multipart } from "../../support/api";
import type { World } from "../../support/world";
import { ALL, NOT_COLLAB, lab, png, specimen, type Case, type Who } from "./shared";

/** A batch into a fresh specimen, started by `who` (by the manager for people outside the lab). */
async function batchOf(w: World, who: Who) {
  const sp = await specimen(w);
  const m = await database();
  const owner = who === "outsider" || who === "anonymous" ? "manager" : who;
  return m.Batch.create({
    labId: w.labId,
    name: "Permission batch",
    target: "specimen",
    studyId: sp.studyId,
    specimenId: sp.id,
    condition: null,
    stage: null,
    pixelSizeUm: 0.65,
    createdBy: w.people[owner].userId,
  });
}

export const cases: Record<string, Case> = {
  "GET /api/v1/labs/[labId]/batches": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "POST /api/v1/labs/[labId]/batches": {
    setup: async (w) => ({
      params: lab(w),
      json: { target: "specimen", specimenId: (await specimen(w)).id, pixelSizeUm: 0.65 },
    }),
    expect: NOT_COLLAB(201),
  },
  "GET /api/v1/labs/[labId]/batches/[batchId]": {
    setup: async (w) => ({ params: lab(w, { batchId: (await batchOf(w, "manager")).id }) }),
    expect: ALL(200),
  },
  "GET /api/v1/labs/[labId]/batches/[batchId]/csv": {
    setup: async (w) => ({ params: lab(w, { batchId: (await batchOf(w, "manager")).id }) }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/batches/[batchId]/uploads": {
    setup: async (w, who) => ({
      params: lab(w, { batchId: (await batchOf(w, who)).id }),
      form: multipart({ name: "p.png", bytes: await png() }),
    }),
    expect: NOT_COLLAB(201),
  },
};
