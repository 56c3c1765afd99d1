/**
 * "Change and run again" of a verification run: the run form filled in from a stored run holds its
 * kinetics, parameters, grid, time, step cap, scheme, seed, noise, snapshots and gradient; sent
 * unchanged it asks for exactly the same RUN.json; with the end time changed, only that changes.
 * The new run records where it came from and both runs link; the original stays as it was.
 */
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { requireLab, type LabContext } from "@/lib/server/access";
import { loadNewRunPage } from "@/lib/server/runs/pages";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { database } from "@/lib/server/services";
import { buildRunBody } from "@/app/(lab)/labs/[labId]/runs/new/run-request-body";
import { startingRunFields, type RunPrefill } from "@/app/(lab)/labs/[labId]/runs/new/use-run-draft";
import { setupRunsLab } from "../support/runs";
import { makeWorld } from "../support/world";

const { lab, api, finished, RUNS, ONE } = setupRunsLab();
let ctx: LabContext;
let original: RunDetailDto;

// A small 1-D Schnakenberg run with every field the form has set away from its default (invented settings).
const FIRST = {
  kinetics: "schnakenberg",
  parameters: { a: 0.1, b: 0.9, d: 20, gamma: 200 },
  grid: { lengthUm: [40], cells: [32], boundary: "periodic" as const },
  endTimeS: 2,
  dtS: 0.001,
  scheme: "implicit-euler" as const,
  stopWhenStationary: true,
  seed: 11,
  noiseAmplitude: 0.02,
  snapshots: 3,
  gradient: { parameter: "d", profile: { kind: "linear" as const, from: 18, to: 24 } },
};

/** The form's body built from the page data, as the browser would send it unchanged. */
async function formBody(runId: string, change?: (f: ReturnType<typeof startingRunFields>) => void) {
  const data = await loadNewRunPage(ctx, null, runId);
  const c = data.change!;
  const prefill: RunPrefill = {
    kinetics: c.kinetics,
    version: c.version,
    parameters: c.parameters,
    lengthScaleUm: c.lengthScaleUm,
    timeScaleS: c.timeScaleS,
    startFrom: c.startFrom,
    change: c,
  };
  const fields = startingRunFields(data.kinetics, prefill, data.earlierRuns);
  change?.(fields);
  const info = data.kinetics.find((k) => k.id === fields.id)!;
  return buildRunBody({ ...fields, dimensional: info.units === "dimensional" }, info, prefill);
}

beforeAll(async () => {
  ctx = await requireLab(lab.w.people.modeller.actor, lab.w.labId);
  const started = await api("POST", RUNS, { json: FIRST });
  expect(started.status, JSON.stringify(started.body)).toBe(202);
  original = await finished(started.body.id);
}, 90_000);

describe("the run form filled in from a run", () => {
  it("holds the run's kinetics, parameters, grid, time, scheme, initial state, snapshots and gradient", async () => {
    const { change } = await loadNewRunPage(ctx, null, original.id);
    expect(change).toMatchObject({
      changedFrom: { id: original.id, name: original.name },
      kinetics: "schnakenberg",
      version: undefined,
      parameters: { a: "0.1", b: "0.9", d: "20", gamma: "200" },
      grid: { dims: "1", lx: "40", cells: "32", boundary: "periodic" },
      endTime: "2",
      dt: "0.001",
      scheme: "implicit-euler",
      stationary: true,
      seed: "11",
      noise: "0.02",
      snapshots: "3",
      gradient: { parameter: "d", from: "18", to: "24" },
      notes: [],
    });
  });

  it("sent unchanged, asks for exactly the same RUN.json, as a new run that links back", async () => {
    const r = await api("POST", RUNS, { json: await formBody(original.id) });
    expect(r.status, JSON.stringify(r.body)).toBe(202);
    const again = r.body as RunDetailDto;
    expect(again.spec).toEqual(original.spec);
    expect(again.changedFrom).toEqual({ id: original.id, name: original.name, status: "succeeded" });
    const back = (await api("GET", ONE, { runId: original.id })).body as RunDetailDto;
    expect(back.changedInto.map((x) => x.id)).toContain(again.id);
    // The new run's result is not what this checks: stop it so it does not hold the shared queue.
    await api("POST", `${ONE}/cancel`, { runId: again.id });
  }, 60_000);

  it("with the end time changed, only the end time (and the snapshot times it spaces) differ; the original is as it was", async () => {
    const body = await formBody(original.id, (f) => {
      f.endTime = "3";
    });
    const r = await api("POST", RUNS, { json: body });
    expect(r.status).toBe(202);
    const again = r.body as RunDetailDto;
    expect(again.spec.endTimeS).toBe(3);
    const { endTimeS: _a, snapshotTimesS: _b, ...rest } = again.spec;
    const { endTimeS: _c, snapshotTimesS: _d, ...was } = original.spec;
    expect(rest).toEqual(was);
    // Three snapshots evenly over [0, end], t = 0 and the end included (lib/simulation/plan-run-spec.ts).
    expect(again.spec.snapshotTimesS).toEqual([0, 1.5, 3]);
    const back = (await api("GET", ONE, { runId: original.id })).body as RunDetailDto;
    expect(back.spec).toEqual(original.spec);
    expect(back.result).toEqual(original.result);
    const m = await database();
    const audit = await m.AuditEvent.findOne({ where: { targetId: again.id } });
    expect(audit?.summary).toMatch(/changed and ran again the verification run/);
    // The new run's result is not what this checks: stop it so it does not hold the shared queue.
    await api("POST", `${ONE}/cancel`, { runId: again.id });
  }, 60_000);
});

describe("what may be changed from", () => {
  it("refuses another lab's run or an unknown id as changedFrom (422 naming the field), writing nothing", async () => {
    const other = await makeWorld();
    const m = await database();
    const foreign = await m.SimulationRun.create({
      labId: other.labId,
      jobId: null,
      status: "failed",
      name: "Elsewhere",
      kineticsKind: "catalogue",
      kineticsRef: "schnakenberg",
      kineticsVersion: null,
      kineticsName: "Schnakenberg",
      spec: {},
      plan: {},
      seed: "1",
      predictedWavelengthUm: null,
      softwareVersion: "test",
      createdBy: null,
    });
    const before = await m.SimulationRun.count({ where: { labId: lab.w.labId } });
    for (const id of [foreign.id, randomUUID()]) {
      const r = await api("POST", RUNS, { json: { ...FIRST, changedFrom: id } });
      expect(r.status).toBe(422);
      expect(r.body.error.message).toBe("Changed from: there is no run with this id in this lab");
      expect(r.body.error.details.field).toBe("changedFrom");
    }
    expect(await m.SimulationRun.count({ where: { labId: lab.w.labId } })).toBe(before);
    await expect(loadNewRunPage(ctx, null, foreign.id)).rejects.toMatchObject({ code: "not_found" });
  });
});
