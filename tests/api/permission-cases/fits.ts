/** Fit routes: list, start, one fit, re-run, exports. Collaborators read; they do not start or re-run. */
import { fitCreateSchema } from "@/lib/contracts/fit";
import { buildFitSpec } from "@/lib/server/fits/spec";
import { SOFTWARE_VERSION } from "@/lib/server/readouts/readouts";
import { runFitJob } from "@/lib/server/fits/job";
import { cancelJob } from "@/lib/server/jobs/queue";
import { database } from "@/lib/server/services";
import type { World } from "../../support/world";
import { ALL, NOT_COLLAB, lab, managerCtx, type Case } from "./shared";

// Wavelengths invented for the matrix (common practice, no source): any Turing-reachable values do.
const body = {
  name: "Matrix fit",
  data: [
    { condition: "control", kind: "fourier", wavelengthUm: 40, uncertaintyUm: 1 },
    { condition: "control", kind: "fourier", wavelengthUm: 41, uncertaintyUm: 1 },
  ],
  models: [
    {
      kinetics: "schnakenberg",
      lengthScaleUm: 40,
      parameters: { gamma: { mode: "free", start: 150, lower: 10, upper: 1000, log: true } },
    },
  ],
  options: { profiles: false, seededStarts: 1, turingSamples: 16 },
};

/** One finished fit per world, shared by the read-only cases; its job handler runs directly. */
const finished = new WeakMap<World, Promise<string>>();
function finishedFit(w: World) {
  if (!finished.has(w)) {
    finished.set(
      w,
      (async () => {
        // Written without a queued job, so only this direct call runs it.
        const built = await buildFitSpec(managerCtx(w), fitCreateSchema.parse(body), SOFTWARE_VERSION, "child-process");
        const m = await database();
        const fit = await m.Fit.create({
          labId: w.labId,
          name: body.name,
          kind: built.kind,
          status: "queued",
          jobId: null,
          spec: built.spec as never,
          provenance: built.provenance as never,
          inputSha256: built.inputSha256,
          softwareVersion: SOFTWARE_VERSION,
          rerunOf: null,
          createdBy: w.people.manager.userId,
        });
        await runFitJob(
          { id: "fixture", labId: w.labId, kind: "fit", payload: { fitId: fit.id }, requestedBy: null },
          { progress: async () => undefined, signal: new AbortController().signal },
        );
        return fit.id;
      })(),
    );
  }
  return finished.get(w)!;
}

/**
 * Cancels the fit jobs the previous caller's POST queued, so the matrix leaves no fits running
 * in the shared queue for later cases to wait behind (the 202 is what these cases check).
 */
async function cancelQueuedFits(w: World) {
  const m = await database();
  const jobs = await m.Job.findAll({ where: { labId: w.labId, kind: "fit", status: ["queued", "running"] } });
  for (const j of jobs) await cancelJob(w.labId, j.id).catch(() => undefined);
}

export const cases: Record<string, Case> = {
  "GET /api/v1/labs/[labId]/fits": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "POST /api/v1/labs/[labId]/fits": {
    setup: async (w) => (await cancelQueuedFits(w), { params: lab(w), json: body }),
    expect: NOT_COLLAB(202),
  },
  "GET /api/v1/labs/[labId]/fits/[fitId]": {
    setup: async (w) => ({ params: lab(w, { fitId: await finishedFit(w) }) }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/fits/[fitId]/rerun": {
    setup: async (w) => (await cancelQueuedFits(w), { params: lab(w, { fitId: await finishedFit(w) }) }),
    expect: NOT_COLLAB(202),
  },
  "GET /api/v1/labs/[labId]/fits/[fitId]/export": {
    setup: async (w) => (
      await cancelQueuedFits(w),
      { params: lab(w, { fitId: await finishedFit(w) }), query: "format=csv" }
    ),
    expect: ALL(200),
  },
};
