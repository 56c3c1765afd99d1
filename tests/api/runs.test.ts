/**
 * Verification runs through the API: a 64² Schnakenberg run finishes in a child process and its\n * final pattern, read by the tissue readout, lies within 20 % of the linear prediction 2π/k*; the seed\n * reproduces the fields bit for bit; the requester is mailed; cancel kills the process; a blow-up is\n * recorded with when and why.
 */
import { describe, expect, it } from "vitest";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeDispersion } from "@/lib/stability";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { getJob, waitForJob } from "@/lib/server/jobs/queue";
import { database } from "@/lib/server/services";
import { waitForMailWithSubject } from "../support/mail";
import { TINY_RUN } from "./permission-cases/runs";
import { setupRunsLab } from "../support/runs";

const { lab, api, finished, RUNS, ONE } = setupRunsLab();

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
    // The runner reads the limit from the stack's configuration (read once, like the server's).
    const limitS = lab.stack.services.config.jobMailAfterS;
    lab.stack.services.config.jobMailAfterS = 0;
    try {
      const started = await api("POST", RUNS, { json: { ...TINY_RUN, name: "Mailed run" } });
      await finished(started.body.id);
      // The requester may get other runs' mails too (any run that took longer than the limit): wait for this one.
      const mail = await waitForMailWithSubject(
        lab.stack.mailboxUrl,
        lab.w.people.modeller.email,
        "[Test Lab] The verification run “Mailed run” finished",
      );
      expect(mail.text).toContain(`/labs/${lab.w.labId}/runs/${started.body.id}`);
    } finally {
      lab.stack.services.config.jobMailAfterS = limitS;
    }
  }, 60_000);

  it("cancel stops the simulation process; the run and its job end cancelled with no files", async () => {
    const started = await api("POST", RUNS, {
      json: { kinetics: "schnakenberg", grid: { lengthUm: [100, 100], cells: [128, 128] }, endTimeS: 1500, seed: 5 },
    });
    expect(started.status).toBe(202);
    const until = Date.now() + 60_000;
    let job = await getJob(lab.w.labId, started.body.jobId);
    while (!(job.status === "running" && job.progress > 0) && Date.now() < until) {
      await new Promise((r) => setTimeout(r, 100));
      job = await getJob(lab.w.labId, started.body.jobId);
    }
    // One progress figure per job: the note says where the simulation is and, with adaptive steps (the
    // default), the current step; the percentage is the job's alone.
    expect(job.progressNote).toMatch(/^simulated t = [\d.]+ of 1500 model time, step [\d.]+ model time$/);
    expect(job.progressNote).not.toContain("%");
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
      labId: lab.w.labId,
      name: "Runaway",
      description: null,
      latestVersion: 1,
      createdBy: lab.w.people.modeller.userId,
    });
    // du/dt = u² − 1 has the one non-negative steady state u = 1 with J = 2 > 0, and u² explodes in finite time (from memory).
    await m.KineticsVersion.create({
      kineticsId: k.id,
      labId: lab.w.labId,
      version: 1,
      createdBy: lab.w.people.modeller.userId,
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
