/** Verification-run routes: list, start (modellers and the manager), one run, its files, cancel. */
import { SOFTWARE_VERSION } from "@/lib/server/readouts/readouts";
import { planRun } from "@/lib/server/runs/plan";
import { runSimulationJob } from "@/lib/server/runs/job";
import { database } from "@/lib/server/services";
import type { World } from "../../support/world";
import { ALL, lab, managerCtx, type Case, type Who } from "./shared";

/** A tiny 1-D Schnakenberg run (defaults a = 0.1, b = 0.9, d = 20: Turing), small enough for seconds. */
export const TINY_RUN = {
  kinetics: "schnakenberg",
  grid: { lengthUm: [50], cells: [32] },
  endTimeS: 2,
  seed: 3,
  snapshots: 2,
};

const finished = new WeakMap<World, Promise<string>>();
function finishedRun(w: World) {
  if (!finished.has(w)) {
    finished.set(
      w,
      (async () => {
        // Run the handler directly: the shared queue may be busy with other cases' jobs.
        const p = await planRun(managerCtx(w), TINY_RUN);
        const m = await database();
        const r = await m.SimulationRun.create({
          labId: w.labId,
          jobId: null,
          status: "queued",
          name: "fixture",
          kineticsKind: p.kineticsKind,
          kineticsRef: p.kineticsRef,
          kineticsVersion: p.kineticsVersion,
          kineticsName: p.kineticsName,
          spec: { ...p.spec },
          plan: { ...p.plan },
          seed: p.seed,
          predictedWavelengthUm: null,
          softwareVersion: SOFTWARE_VERSION,
          createdBy: w.people.manager.userId,
        });
        await runSimulationJob(
          { id: "fixture", labId: w.labId, kind: "simulation", payload: { runId: r.id }, requestedBy: null },
          { progress: async () => undefined, signal: new AbortController().signal },
        );
        return r.id;
      })(),
    );
  }
  return finished.get(w)!;
}

const RUN_CREATORS = (s: number): Record<Who, number> => ({
  manager: s,
  scientist: 403,
  modeller: s,
  collaborator: 403,
  outsider: 404,
  anonymous: 401,
});

export const cases: Record<string, Case> = {
  "GET /api/v1/labs/[labId]/runs": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "POST /api/v1/labs/[labId]/runs": {
    setup: async (w) => ({ params: lab(w), json: { ...TINY_RUN, endTimeS: 0.5 } }),
    expect: RUN_CREATORS(202),
  },
  "GET /api/v1/labs/[labId]/runs/[runId]": {
    setup: async (w) => ({ params: lab(w, { runId: await finishedRun(w) }) }),
    expect: ALL(200),
  },
  "GET /api/v1/labs/[labId]/runs/[runId]/files/[name]": {
    setup: async (w) => ({ params: lab(w, { runId: await finishedRun(w), name: "final-0.png" }) }),
    expect: ALL(200),
  },
  // A finished run cannot be cancelled (409) by those allowed to try; own-scope roles did not start it (403).
  "POST /api/v1/labs/[labId]/runs/[runId]/cancel": {
    setup: async (w) => ({ params: lab(w, { runId: await finishedRun(w) }) }),
    expect: { manager: 409, scientist: 403, modeller: 403, collaborator: 403, outsider: 404, anonymous: 401 },
  },
};
