/**
 * Verification runs with cross-diffusion and with a chosen initial field (an earlier run's final pattern).
 */
import { describe, expect, it } from "vitest";
import { database } from "@/lib/server/services";
import { setupRunsLab } from "../support/runs";

const { lab, api, finished, RUNS, ONE } = setupRunsLab();

let firstId = "";

describe("cross-diffusion", () => {
  async function labKinetics(name: string, diffusion: (string | number)[][]) {
    const m = await database();
    const k = await m.LabKinetics.create({
      labId: lab.w.labId,
      name,
      description: null,
      latestVersion: 1,
      createdBy: lab.w.people.modeller.userId,
    });
    await m.KineticsVersion.create({
      kineticsId: k.id,
      labId: lab.w.labId,
      version: 1,
      createdBy: lab.w.people.modeller.userId,
      definition: {
        name,
        species: ["u", "v"],
        parameters: [
          { name: "a", default: 0.1 },
          { name: "b", default: 0.9 },
          { name: "d", default: 20 },
        ],
        reactions: ["a - u + u^2 * v", "b - u^2 * v"],
        diffusion,
      },
    });
    return k.id;
  }
  it("a lab kinetics with a full diffusion matrix runs, and the run records the matrix", async () => {
    const id = await labKinetics("Schnakenberg with cross terms", [
      [1, 0.5],
      [-0.2, "d"],
    ]);
    const started = await api("POST", RUNS, {
      json: { kinetics: id, grid: { lengthUm: [60], cells: [64] }, endTimeS: 50, seed: 31, snapshots: 2 },
    });
    expect(started.status).toBe(202);
    expect(started.body.plan.diffusion).toEqual([
      [1, 0.5],
      [-0.2, 20],
    ]);
    const r = await finished(started.body.id);
    expect(r.status).toBe("succeeded");
    expect(r.stopReason).toBe("end-time");
  }, 60_000);
  it("a matrix with a negative eigenvalue is refused before any job exists", async () => {
    const id = await labKinetics("Backward", [
      [1, 3],
      [3, 1],
    ]);
    const m = await database();
    const before = await m.Job.count();
    const res = await api("POST", RUNS, { json: { kinetics: id, grid: { lengthUm: [60], cells: [64] }, endTimeS: 5 } });
    // The dispersion engine refuses it first (lib/stability/diffusion-check.ts), with the same reason the solver would give.
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe(
      "The diffusion matrix must have eigenvalues with positive real part (smallest is -2.00000); otherwise short waves grow without bound.",
    );
    expect(await m.Job.count()).toBe(before);
  });
});

describe("a chosen initial field: the final pattern of an earlier run", () => {
  const base = {
    kinetics: "schnakenberg",
    parameters: { a: 0.1, b: 0.9, d: 20 },
    grid: { lengthUm: [60], cells: [64] },
    scheme: "implicit-euler",
    dtS: 0.01,
    snapshots: 2,
  };
  it("20 then 10 time units from the stored fields give the fields of 30 in one go, to the bit; the initial fields are kept", async () => {
    // A one-step scheme restarted from its own state repeats the same steps (common practice, no source).
    const first = await finished((await api("POST", RUNS, { json: { ...base, endTimeS: 20, seed: 21 } })).body.id);
    const whole = await finished((await api("POST", RUNS, { json: { ...base, endTimeS: 30, seed: 21 } })).body.id);
    const started = await api("POST", RUNS, { json: { ...base, endTimeS: 10, startFrom: { runId: first.id } } });
    expect(started.status).toBe(202);
    expect(started.body.plan.startFrom).toMatchObject({ runId: first.id, name: first.name, timeS: 20 });
    expect(started.body.spec.initial).toMatchObject({
      fieldFiles: ["initial-0.f64", "initial-1.f64"],
      noiseAmplitude: 0,
      fromRun: { runId: first.id, finalSha256: first.result!.finalSha256 },
    });
    const cont = await finished(started.body.id);
    expect(cont.status).toBe("succeeded");
    expect([first.plan.dtS, whole.plan.dtS, cont.plan.dtS]).toEqual([0.01, 0.01, 0.01]); // the same step in all three
    expect(cont.result!.finalSha256).toEqual(whole.result!.finalSha256);
    const kept = await api("GET", `${ONE}/files/[name]`, { runId: cont.id, name: "initial-1.f64" });
    const source = await api("GET", `${ONE}/files/[name]`, { runId: first.id, name: "final-1.f64" });
    expect(Buffer.from(kept.bytes!).equals(Buffer.from(source.bytes!))).toBe(true);
  }, 120_000);

  it("with parameters where the steady state is stable it starts anyway and says what the run shows", async () => {
    const first = await finished((await api("POST", RUNS, { json: { ...base, endTimeS: 5, seed: 22 } })).body.id);
    const res = await api("POST", RUNS, {
      json: { ...base, parameters: { a: 0.1, b: 0.9, d: 5 }, endTimeS: 1, startFrom: { runId: first.id } },
    });
    expect(res.status).toBe(202);
    expect(res.body.plan.warnings).toEqual([
      "The homogeneous steady state is stable at these parameter values, so no new pattern would form from noise; the run shows whether the earlier pattern persists.",
    ]);
    expect(res.body.seed).toBe("none"); // no noise added: no random numbers drawn
    expect(res.body.name).toBe(`Schnakenberg, 64, from “${first.name}”`);
    await finished(res.body.id);
  }, 60_000);

  it.each([
    [
      "an unknown run",
      () => "00000000-0000-4000-8000-000000000000",
      {},
      "Start from (an earlier run): there is no run with this id in this lab.",
    ],
    [
      "another grid",
      () => firstId,
      { grid: { lengthUm: [60], cells: [128] } },
      /^Start from \(an earlier run\): the run “.*” has 64 cells; this run asks for 128\. A chosen initial field needs the same cells: choose the same grid\.$/,
    ],
  ])(
    "refuses %s before any job exists",
    async (_what, id, change, message) => {
      if (!firstId)
        firstId = (await finished((await api("POST", RUNS, { json: { ...base, endTimeS: 1, seed: 23 } })).body.id)).id;
      const m = await database();
      const before = await m.Job.count();
      const res = await api("POST", RUNS, { json: { ...base, endTimeS: 1, ...change, startFrom: { runId: id() } } });
      expect(res.status).toBe(422);
      expect(res.body.error.message).toMatch(message);
      expect(await m.Job.count()).toBe(before);
    },
    60_000,
  );
});
