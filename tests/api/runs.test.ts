/**
 * Verification runs through the API: a 64² Schnakenberg run finishes in a child process and its
 * final pattern, read by the tissue readout, lies within 20 % of the linear prediction 2π/k*;
 * the seed reproduces the fields bit for bit; cancel kills the process; limits answer 422 with
 * exact sentences before any job exists; a blow-up is recorded with when and why.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeDispersion, computeGradientDispersion } from "@/lib/stability";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { getJob, waitForJob } from "@/lib/server/jobs/queue";
import { database } from "@/lib/server/services";
import { call, discoverRoutes } from "../support/api";
import { waitForMailWithSubject } from "../support/mail";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";
import { TINY_RUN } from "./permission-cases/runs";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;

const RUNS = "/api/v1/labs/[labId]/runs";
const ONE = `${RUNS}/[runId]`;
async function api(
  method: "GET" | "POST",
  path: string,
  o: { json?: unknown; runId?: string; name?: string; who?: "modeller" | "scientist" } = {},
) {
  const res = await call(routes.get(`${method} ${path}`)!, method, path, {
    token: w.people[o.who ?? "modeller"].token,
    params: { labId: w.labId, runId: o.runId ?? "", name: o.name ?? "" },
    json: o.json,
  });
  const type = res.headers.get("content-type") ?? "";
  return {
    status: res.status,
    body: type.includes("json") ? await res.json() : null,
    bytes: type.includes("json") ? null : new Uint8Array(await res.arrayBuffer()),
    type,
  };
}
async function finished(runId: string): Promise<RunDetailDto> {
  const start = await api("GET", ONE, { runId });
  await waitForJob(start.body.jobId, 90_000);
  return (await api("GET", ONE, { runId })).body as RunDetailDto;
}

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
});
afterAll(async () => stack?.close());

describe("a verification run", () => {
  it("64² Schnakenberg: finishes, stores snapshots and fields, and its readout is within 20 % of 2π/k*", async () => {
    const started = await api("POST", RUNS, {
      json: {
        kinetics: "schnakenberg",
        parameters: { a: 0.1, b: 0.9, d: 20 },
        grid: { lengthUm: [100, 100], cells: [64, 64] },
        endTimeS: 300,
        seed: 1,
        noiseAmplitude: 0.01,
        snapshots: 4,
      },
    });
    expect(started.status).toBe(202);
    expect(started.body.status).toBe("queued");
    const r = await finished(started.body.id);
    expect(r.status).toBe("succeeded");
    expect(r.result!.stopReason).toBe("end-time");
    expect(r.result!.snapshots.map((s) => s.timeS)).toEqual([0, 100, 200, 300]);
    // Source: linear theory (SCIENCE.md §1), computed here by the stability core at the same parameters.
    const linear = computeDispersion(getCatalogueKinetics("schnakenberg"), { a: 0.1, b: 0.9, d: 20 });
    expect(r.plan.prediction!.wavelength).toBeCloseTo(linear.fastest!.wavelength, 9);
    const lambda = r.result!.readout!.wavelength.wavelengthUm!;
    // 20 %: the tolerance of tests/lib/simulation/pattern-readout.test.ts (common practice, no source).
    expect(Math.abs(lambda / linear.fastest!.wavelength - 1)).toBeLessThan(0.2);
    expect(r.wavelength).toBe(lambda);
    expect(r.result!.comparison!.sentence).toMatch(
      /^The simulated wavelength .* (agrees with|differs from) the linear prediction 2π\/k\* = /,
    );
    expect(r.seed).toBe("1");
    expect(r.spec).toMatchObject({
      kinetics: { catalogue: "schnakenberg" },
      initial: { seed: 1 },
      grid: { cells: [64, 64] },
    });
    expect(Object.keys(r.files)).toEqual(
      expect.arrayContaining([
        "final-0.f64",
        "final-0.png",
        "final-1.png",
        "snapshot-0-0.png",
        "snapshot-3-1.png",
        "spectrum.json",
        "fft.png",
        "run.json",
      ]),
    );
    const png = await api("GET", `${ONE}/files/[name]`, { runId: r.id, name: "snapshot-3-0.png" });
    expect(png.status).toBe(200);
    expect([...png.bytes!.slice(1, 4)].map((c) => String.fromCharCode(c)).join("")).toBe("PNG"); // PNG signature (PNG spec §5.2)
    const f64 = await api("GET", `${ONE}/files/[name]`, { runId: r.id, name: "final-0.f64" });
    expect(f64.bytes!.length).toBe(64 * 64 * 8);
    const list = await api("GET", RUNS, { who: "scientist" });
    expect(list.body.items.some((x: { id: string }) => x.id === r.id)).toBe(true);
  }, 120_000);

  it("the same seed gives the same fields to the bit; another seed does not", async () => {
    const ids = [];
    for (const seed of [11, 11, 12])
      ids.push((await api("POST", RUNS, { json: { ...TINY_RUN, seed } })).body.id as string);
    const [a, b, c] = await Promise.all(ids.map(finished));
    expect(a.result!.finalSha256).toEqual(b.result!.finalSha256);
    expect(a.result!.fields).toEqual(b.result!.fields);
    expect(c.result!.finalSha256[0]).not.toBe(a.result!.finalSha256[0]);
  }, 120_000);

  it("e-mails the requester when the run ends, through the runner's mail hook", async () => {
    process.env.JOB_MAIL_AFTER_S = "0";
    try {
      const started = await api("POST", RUNS, { json: { ...TINY_RUN, name: "Mailed run" } });
      await finished(started.body.id);
      // The requester may get other runs' mails too (any run that took longer than the limit): wait for this one.
      const mail = await waitForMailWithSubject(
        stack.mailboxUrl,
        w.people.modeller.email,
        "[Test Lab] The verification run “Mailed run” finished",
      );
      expect(mail.text).toContain(`/labs/${w.labId}/runs/${started.body.id}`);
    } finally {
      delete process.env.JOB_MAIL_AFTER_S;
    }
  }, 60_000);

  it("cancel stops the simulation process; the run and its job end cancelled with no files", async () => {
    const started = await api("POST", RUNS, {
      json: { kinetics: "schnakenberg", grid: { lengthUm: [100, 100], cells: [128, 128] }, endTimeS: 1500, seed: 5 },
    });
    expect(started.status).toBe(202);
    const until = Date.now() + 60_000;
    let job = await getJob(w.labId, started.body.jobId);
    while (!(job.status === "running" && job.progress > 0) && Date.now() < until) {
      await new Promise((r) => setTimeout(r, 100));
      job = await getJob(w.labId, started.body.jobId);
    }
    expect(job.progressNote).toMatch(/^simulated t = [\d.]+ of 1500 model time \(\d+ %\)$/);
    const cancelled = await api("POST", `${ONE}/cancel`, { runId: started.body.id });
    expect(cancelled.status).toBe(200);
    expect((await waitForJob(started.body.jobId, 20_000)).status).toBe("cancelled");
    const r = (await api("GET", ONE, { runId: started.body.id })).body as RunDetailDto;
    expect(r.status).toBe("cancelled");
    expect(r.error).toBe("the run was cancelled");
    expect(r.files).toEqual({});
    expect((await api("POST", `${ONE}/cancel`, { runId: r.id })).status).toBe(409);
  }, 90_000);

  it("a blow-up is recorded: when, why, and the last good state is kept", async () => {
    const m = await database();
    const k = await m.LabKinetics.create({
      labId: w.labId,
      name: "Runaway",
      description: null,
      latestVersion: 1,
      createdBy: w.people.modeller.userId,
    });
    // du/dt = u² − 1 has the one non-negative steady state u = 1 with J = 2 > 0, and u² explodes in finite time (from memory).
    await m.KineticsVersion.create({
      kineticsId: k.id,
      labId: w.labId,
      version: 1,
      createdBy: w.people.modeller.userId,
      definition: {
        name: "Runaway",
        species: ["u", "v"],
        parameters: [{ name: "g", default: 1, min: 0, max: 10 }],
        reactions: ["g * (u^2 - 1)", "u - v"],
        diffusion: [1, 1],
      },
    });
    const started = await api("POST", RUNS, {
      json: { kinetics: k.id, grid: { lengthUm: [50], cells: [32] }, endTimeS: 30, seed: 2, noiseAmplitude: 0.05 },
    });
    expect(started.status).toBe(202);
    expect(started.body.plan.warnings[0]).toMatch(/^The steady state is unstable at k = 0/);
    expect(started.body.kinetics).toMatchObject({ kind: "lab", version: 1, name: "Runaway" });
    const r = await finished(started.body.id);
    expect(r.status).toBe("succeeded");
    expect(r.stopReason).toBe("blow-up");
    const b = r.result!.blowUp!;
    expect(b.timeS).toBeGreaterThan(0);
    expect(b.lastGoodTimeS).toBeLessThan(b.timeS);
    expect(r.error).toMatch(
      new RegExp(
        `^Blow-up at step ${b.step} \\(t = [\\d.]+ s\\): .*the fields are the last good state, at t = ${b.lastGoodTimeS} s\\.`,
      ),
    );
    expect(r.result!.fields.every((f) => Number.isFinite(f.max))).toBe(true);
  }, 60_000);
});

describe("a parameter varying in space", () => {
  it("runs with the kinetics page's linear gradient and keeps the local prediction 2π/k*(x) beside the local readout", async () => {
    const gradient = { parameter: "d", profile: { kind: "linear", from: 15, to: 40 } };
    const started = await api("POST", RUNS, {
      json: {
        kinetics: "schnakenberg",
        grid: { lengthUm: [200, 25], cells: [128, 16] },
        endTimeS: 200,
        seed: 4,
        snapshots: 2,
        gradient,
      },
    });
    expect(started.status).toBe(202);
    expect(started.body.spec.spatialParameters).toEqual({
      d: { kind: "linear", axis: "x", fromValue: 15, toValue: 40 },
    });
    // Known answer from the stability core: the local dispersion along the same profile (SCIENCE.md §1, local reading).
    const local = computeGradientDispersion(
      getCatalogueKinetics("schnakenberg"),
      {},
      { parameter: "d", profile: { kind: "linear", from: 15, to: 40 }, length: 200, samples: 101 },
    );
    expect(started.body.plan.gradientPrediction.wavelengths).toEqual(local.points.map((q) => q.wavelength));
    const r = await finished(started.body.id);
    expect(r.status).toBe("succeeded");
    expect(Object.keys(r.files)).toContain("spectrum.json");
  }, 60_000);
});

describe("a run started from a fit", () => {
  it("takes the fit's kinetics, parameters and scales, and compares with the condition's measured mean", async () => {
    const m = await database();
    // A finished fit as the fit job stores it (invented numbers: this tests the wiring, not the fit).
    const prediction = {
      condition: "control",
      parameters: { gamma: 1, a: 0.1, b: 0.9, d: 20 },
      lengthScaleUm: 2,
      timeScaleS: 1,
      classification: "Turing",
      predictedUm: null,
      measuredMeanUm: 24,
      measuredSeUm: 1,
      n: 3,
      curve: { k: [], sigma: [], imSigma: [] },
      bands: [],
      kStar: null,
    };
    const fit = await m.Fit.create({
      labId: w.labId,
      name: "Fixture fit",
      kind: "fit",
      status: "succeeded",
      jobId: null,
      spec: {},
      inputSha256: "0".repeat(64),
      softwareVersion: "test",
      rerunOf: null,
      createdBy: w.people.modeller.userId,
      provenance: {
        data: [
          {
            index: 0,
            source: "typed",
            condition: "control",
            kind: "fourier",
            readoutId: null,
            measure: null,
            filename: null,
            specimenLabel: null,
            studyId: null,
            studyName: null,
            inputSha256: null,
            readoutSoftwareVersion: null,
          },
        ],
        kinetics: [],
        settings: {},
        softwareVersion: "test",
        specSha256: "",
        runner: "in-process",
      },
      result: {
        models: [
          {
            label: "Schnakenberg",
            kinetics: {
              label: "Schnakenberg",
              kind: "catalogue",
              id: "schnakenberg",
              version: null,
              name: "Schnakenberg",
              source: "",
              units: "non-dimensional",
              definitionSha256: null,
            },
            fit: {},
            predictions: [prediction],
            elapsedMs: 1,
          },
        ],
        comparison: null,
        runner: "in-process",
        elapsedMs: 1,
      },
    });
    const started = await api("POST", RUNS, {
      json: {
        kinetics: "ignored",
        grid: { lengthUm: [100, 100], cells: [64, 64] },
        endTimeS: 300,
        seed: 1,
        snapshots: 2,
        fit: { fitId: fit.id, condition: "control" },
      },
    });
    expect(started.status).toBe(202);
    expect(started.body.spec.parameters).toEqual({ gamma: 1, a: 0.1, b: 0.9, d: 20 });
    expect(started.body.spec.scales).toEqual({ lengthScaleUm: 2, timeScaleS: 1 });
    expect(started.body.plan.fromFit).toMatchObject({
      fitName: "Fixture fit",
      condition: "control",
      measuredMeanUm: 24,
      n: 3,
    });
    // 2π/k* in µm = ℓ · 2π/k* in model units (SCIENCE.md §3).
    const linear = computeDispersion(getCatalogueKinetics("schnakenberg"), { a: 0.1, b: 0.9, d: 20 });
    expect(started.body.predictedWavelength).toBeCloseTo(2 * linear.fastest!.wavelength, 9);
    const r = await finished(started.body.id);
    expect(r.lengthUnit).toBe("µm");
    expect(r.wavelength).toBeCloseTo(2 * r.result!.readout!.wavelength.wavelengthUm!, 9);
    expect(r.result!.measurementComparison!.sentence).toMatch(
      /^The simulated wavelength .* (agrees with|disagrees with) the measured mean of “control” \(n = 3\), 24 ± 1 µm/,
    );
    const missing = await api("POST", RUNS, {
      json: {
        kinetics: "x",
        grid: { lengthUm: [50], cells: [32] },
        endTimeS: 1,
        fit: { fitId: fit.id, condition: "treated" },
      },
    });
    expect(missing.body.error.message).toBe("fit.condition: the fit has no condition “treated” (it has “control”).");
  }, 60_000);
});

describe("cross-diffusion", () => {
  async function labKinetics(name: string, diffusion: (string | number)[][]) {
    const m = await database();
    const k = await m.LabKinetics.create({
      labId: w.labId,
      name,
      description: null,
      latestVersion: 1,
      createdBy: w.people.modeller.userId,
    });
    await m.KineticsVersion.create({
      kineticsId: k.id,
      labId: w.labId,
      version: 1,
      createdBy: w.people.modeller.userId,
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
      "startFrom.runId: there is no run with this id in this lab.",
    ],
    [
      "another grid",
      () => firstId,
      { grid: { lengthUm: [60], cells: [128] } },
      /^startFrom\.runId: the run “.*” has 64 cells; this run asks for 128\. A chosen initial field needs the same cells: choose the same grid\.$/,
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
let firstId = "";

describe("refused before any job exists", () => {
  const base = { kinetics: "schnakenberg", grid: { lengthUm: [100, 100], cells: [64, 64] }, endTimeS: 10 };
  it.each([
    [
      "cells not a power of two",
      { grid: { lengthUm: [100, 100], cells: [100, 64] } },
      "grid.cells[0] must be a power of two (fft.js sizes), got 100; use 64 or 128.",
    ],
    [
      "a rectangle above 2048 per axis",
      { grid: { lengthUm: [100, 100], cells: [4096, 64] } },
      "grid.cells[0] must be an integer from 4 to 2048, got 4096.",
    ],
    ["too many steps", { endTimeS: 2e6 }, "endTimeS / dtS needs 20000000 steps; the limit is 10000000."],
    [
      "over the CPU budget",
      { grid: { lengthUm: [100, 100], cells: [512, 512] }, endTimeS: 1000 },
      "grid.cells: 262144 cells × 2 species × 10000 steps = 5242880000 cell-steps; one run may take at most 2621440000 (256² cells × 2 species × 20000 steps, about 103 s on this server). Use fewer cells or a shorter endTimeS.",
    ],
    [
      "a stable steady state",
      { parameters: { d: 5 } },
      "parameters: the homogeneous steady state is stable at these parameter values — no mode grows, so the noise decays and there is no pattern to read. Choose parameters inside the Turing space (see the Turing-space map of this kinetics).",
    ],
    [
      "a parameter out of range",
      { parameters: { a: 500 } },
      "Parameter a = 500 is outside its allowed range [0, 100].",
    ],
  ])("%s", async (_what, change, message) => {
    const m = await database();
    const before = await m.Job.count();
    const res = await api("POST", RUNS, { json: { ...base, ...change } });
    expect(res.body.error.message).toBe(message);
    expect(res.status).toBe(message.startsWith("Parameter a") ? 400 : 422);
    expect(await m.Job.count()).toBe(before);
  });

  it("a bench scientist may not start a run", async () => {
    const res = await api("POST", RUNS, { who: "scientist", json: base });
    expect(res.status).toBe(403);
  });
});
