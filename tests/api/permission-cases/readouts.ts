/** Readout routes: list, one readout, derived products, start per upload, condition comparison (JSON, CSV). */
import { encodePng } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";
import { imageReadoutSettingsSchema } from "@/lib/contracts/readout";
import { SOFTWARE_VERSION } from "@/lib/server/readouts/readouts";
import { runReadoutJob } from "@/lib/server/readouts/job";
import { database } from "@/lib/server/services";
import { storeUpload } from "@/lib/server/uploads/uploads";
import { sha256Hex } from "@/lib/server/secrets";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import type { World } from "../../support/world";
import { ALL, NOT_COLLAB, lab, managerCtx, specimen, upload, type Case } from "./shared";

/** One finished stripe readout per world, shared by the read-only cases. */
const finished = new WeakMap<World, Promise<{ readoutId: string; studyId: string }>>();
function finishedReadout(w: World) {
  if (!finished.has(w)) {
    finished.set(
      w,
      (async () => {
        const sp = await specimen(w);
        const bytes = await encodePng(
          makeStripes({ width: 96, height: 96, wavelengthPx: 12, angleDeg: 20, noise: 0.05, seed: 7 }),
        );
        const file = `${mkdtempSync(`${tmpdir()}/mk-`)}/s.png`;
        writeFileSync(file, bytes);
        const u = await storeUpload(managerCtx(w), sp.id, {
          path: file,
          filename: "s.png",
          sizeBytes: bytes.length,
          sha256: sha256Hex(bytes),
          kind: "image",
          contentType: "image/png",
          pixelSizeUm: 0.5,
          pixelSizeSource: "uploader",
        });
        // Run the handler directly: the shared queue may be busy with other cases' slow jobs.
        const m = await database();
        const r = await m.Readout.create({
          labId: w.labId,
          uploadId: u.id,
          specimenId: sp.id,
          jobId: null,
          status: "queued",
          kind: "image",
          settings: {
            kind: "image",
            ...imageReadoutSettingsSchema.parse({}),
            pixelSizeUm: 0.5,
            pixelSizeSource: "uploader",
          },
          pixelSizeUm: 0.5,
          inputSha256: u.sha256,
          softwareVersion: SOFTWARE_VERSION,
          createdBy: w.people.manager.userId,
        });
        await runReadoutJob(
          { id: "fixture", labId: w.labId, kind: "readout", payload: { readoutId: r.id }, requestedBy: null },
          { progress: async () => undefined, signal: new AbortController().signal },
        );
        return { readoutId: r.id, studyId: sp.studyId };
      })(),
    );
  }
  return finished.get(w)!;
}

export const cases: Record<string, Case> = {
  "GET /api/v1/labs/[labId]/readouts": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "GET /api/v1/labs/[labId]/readouts/[readoutId]": {
    setup: async (w) => ({ params: lab(w, { readoutId: (await finishedReadout(w)).readoutId }) }),
    expect: ALL(200),
  },
  "GET /api/v1/labs/[labId]/readouts/[readoutId]/derived/[product]": {
    setup: async (w) => ({
      params: lab(w, { readoutId: (await finishedReadout(w)).readoutId, product: "spectrum.json" }),
    }),
    expect: ALL(200),
  },
  "GET /api/v1/labs/[labId]/uploads/[uploadId]/readouts": {
    setup: async (w) => ({ params: lab(w, { uploadId: (await upload(w)).id }) }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts": {
    setup: async (w) => ({ params: lab(w, { uploadId: (await upload(w)).id }), json: { flatten: "none" } }),
    expect: NOT_COLLAB(202),
  },
  "GET /api/v1/labs/[labId]/studies/[studyId]/comparison": {
    setup: async (w) => ({ params: lab(w, { studyId: (await finishedReadout(w)).studyId }) }),
    expect: ALL(200),
  },
  "GET /api/v1/labs/[labId]/studies/[studyId]/comparison/csv": {
    setup: async (w) => ({ params: lab(w, { studyId: (await finishedReadout(w)).studyId }) }),
    expect: ALL(200),
  },
};
