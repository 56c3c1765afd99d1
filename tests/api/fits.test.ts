/**
 * Fits through the API: wavelengths generated from known Schnakenberg parameters are fitted back
 * within their 95 % intervals (round trip; the generating parameters are the source), one datum
 * with two free parameters is reported not identifiable, a comparison ranks the generating
 * kinetics first, provenance is recorded, a re-run reproduces the numbers, a collaborator may read
 * but not start, exports parse, and the job-finish e-mail arrives (or not).
 */
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import packageJson from "@/package.json";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import { numbersOf } from "@/lib/server/fits/result";
import { waitForJob } from "@/lib/server/jobs/queue";
import { database } from "@/lib/server/services";
import { waitForMailWithSubject } from "../support/mail";
import { makePerson } from "../support/world";
import { FITS, TRUE_GAMMA, lambdaUm, roundTrip, roundTripData, setupFitsLab } from "../support/fits";

const { lab, api, startAndWait, inbox } = setupFitsLab();
let first: FitDetailDto;
beforeAll(async () => {
  first = await startAndWait(roundTrip);
}, 90_000);

describe("fitting", () => {
  it("fits the generating γ per condition back within its 95 % profile interval (round trip)", () => {
    const m = first.result!.models[0];
    expect(m.fit.verdict).toBe("fits");
    expect(m.fit.identifiability.identifiable).toBe(true);
    for (const [condition, gamma] of Object.entries(TRUE_GAMMA)) {
      const p = m.fit.parameters.find((x) => x.name === `gamma[${condition}]`)!;
      expect(p.interval95!.lower.value!).toBeLessThan(gamma);
      expect(p.interval95!.upper.value!).toBeGreaterThan(gamma);
      expect(Math.abs(p.value - gamma) / gamma).toBeLessThan(0.01);
      expect(p.standardError).toBeGreaterThan(0);
    }
    // Symmetric ±1 % pairs: each residual is ±0.5 σ, so χ² = 4 × 0.25 = 1 (arithmetic), n − p = 2.
    expect(m.fit.chiSquare).toBeCloseTo(1, 2);
    expect(m.fit.reducedChiSquare).toBeCloseTo(0.5, 2);
    expect(m.fit.residuals).toHaveLength(4);
    // Predictions at the fit: the model's 2π/k* per condition equals the measured mean (exact data).
    for (const pr of m.predictions)
      expect(pr.predictedUm!).toBeCloseTo(lambdaUm({ gamma: TRUE_GAMMA[pr.condition as keyof typeof TRUE_GAMMA] }), 1);
    expect(m.predictions[0].curve.k.length).toBeGreaterThan(50);
    expect(m.predictions[0].elasticities.map((e) => e.name)).toContain("gamma");
  });

  it("the fits list shows the fit's kinetics, conditions, data, best kinetics and verdict, also for a fit made before its stored summary", async () => {
    const listed = async () => {
      const r = await api("GET", FITS, { query: "pageSize=200" });
      const items = ((await r.res.json()) as { items: { id: string }[] }).items;
      return items.find((f) => f.id === first.id);
    };
    // The round trip (tests/support/fits.ts): Schnakenberg alone, two measurements per condition.
    const verdict = first.result!.models[0].fit.verdict;
    const expected = {
      kinetics: ["Schnakenberg"],
      conditions: ["control", "inhibitor"],
      n: 4,
      best: "Schnakenberg",
      verdict,
    };
    expect(verdict).toBe("fits");
    expect(await listed()).toMatchObject(expected);
    const m = await database();
    const stored = (await m.Fit.findByPk(first.id))!.summary;
    expect(stored).toEqual(expected);
    // A fit made before the summary column has none: the list reads its spec, provenance and result.
    await m.Fit.update({ summary: null }, { where: { id: first.id } });
    try {
      expect(await listed()).toMatchObject(expected);
    } finally {
      await m.Fit.update({ summary: stored }, { where: { id: first.id } });
    }
  });

  it("records provenance: kinetics and its source, settings, software version, input hash, and the runner", () => {
    expect(first.status).toBe("succeeded");
    expect(first.softwareVersion).toBe(`morphokin ${packageJson.version}`);
    expect(first.inputSha256).toMatch(/^[0-9a-f]{64}$/);
    expect(first.provenance.specSha256).toBe(first.inputSha256);
    expect(first.provenance.kinetics[0]).toMatchObject({
      kind: "catalogue",
      id: "schnakenberg",
      version: null,
      name: "Schnakenberg",
    });
    expect(first.provenance.kinetics[0].source).toMatch(/Schnakenberg J\. \(1979\)/);
    expect(first.provenance.settings).toMatchObject({ seededStarts: 4, turingSamples: 64, profiles: true });
    expect(first.provenance.data.map((d) => d.source)).toEqual(["typed", "typed", "typed", "typed"]);
    expect(first.result!.runner).toBe("child-process");
    // Parameters left out are written down as fixed at their defaults, so the spec is complete.
    expect(first.spec.models[0].parameters.a).toEqual({ mode: "fixed", value: 0.1 });
    expect(first.spec.kinetics).toBe("schnakenberg");
  });

  it("says of a finished fit what its row says, as of a finished readout or run: no job progress note", () => {
    expect(first).toMatchObject({ status: "succeeded", progress: 1, progressNote: null, error: null });
  });

  it("re-run gives the same numbers, as a new fit pointing at the original", async () => {
    const r = await api("POST", `${FITS}/[fitId]/rerun`, { params: { fitId: first.id } });
    expect(r.status).toBe(202);
    const again = (await r.res.json()) as FitDetailDto;
    expect(again.rerunOf).toBe(first.id);
    expect(again.inputSha256).toBe(first.inputSha256);
    await waitForJob(again.jobId!, 60_000);
    const done = (await (
      await api("GET", `${FITS}/[fitId]`, { params: { fitId: again.id } })
    ).res.json()) as FitDetailDto;
    expect(numbersOf(done.result!)).toEqual(numbersOf(first.result!));
  });

  it("one datum and two free parameters: not identifiable, with the curve of equally good solutions", async () => {
    const fit = await startAndWait({
      name: "Too few data",
      data: [roundTripData[0]],
      models: [
        {
          kinetics: "schnakenberg",
          lengthScaleUm: 40,
          parameters: {
            gamma: { mode: "free", start: 150, lower: 50, upper: 500, log: true },
            d: { mode: "free", start: 20, lower: 12, upper: 60, log: true },
          },
        },
      ],
      options: { valleyPoints: 9 },
    });
    const id = fit.result!.models[0].fit.identifiability;
    expect(id.identifiable).toBe(false);
    expect(id.reasons.join(" ")).toMatch(/1 measurement|n ≤ p|fewer|cannot/i);
    expect(id.valley!.points.length).toBe(9);
    expect(id.valley!.points.some((p) => p.withinConfidence)).toBe(true);
  });

  it("a comparison ranks the generating kinetics first by AICc, with Akaike weights", async () => {
    // Data from Schnakenberg with γ = 150 and d fixed per condition (10…160); χ² ≈ 0 for it by construction.
    const ds = { d10: 10, d20: 20, d40: 40, d80: 80, d160: 160 };
    const data = Object.entries(ds).map(([condition, d]) => {
      const l = lambdaUm({ gamma: 150, d });
      return { condition, kind: "fourier" as const, wavelengthUm: l, uncertaintyUm: 0.01 * l };
    });
    const fit = await startAndWait({
      name: "Which kinetics",
      data,
      models: [
        {
          kinetics: "brusselator",
          lengthScaleUm: 40,
          parameters: {
            a: { mode: "free", start: 1.5, lower: 0.5, upper: 5 },
            b: { mode: "free", start: 2.5, lower: 0.5, upper: 20 },
            Dv: { mode: "fixed", value: ds },
          },
        },
        {
          kinetics: "schnakenberg",
          lengthScaleUm: 40,
          parameters: {
            gamma: { mode: "free", start: 100, lower: 10, upper: 1000, log: true },
            d: { mode: "fixed", value: ds },
          },
        },
      ],
      options: { profiles: false },
    });
    expect(fit.kind).toBe("comparison");
    const ranking = fit.result!.comparison!.ranking;
    expect(ranking.map((r) => r.label)).toEqual(["Schnakenberg", "Brusselator"]);
    expect(ranking[0].akaikeWeight!).toBeGreaterThan(0.99);
    expect(ranking[0].verdict).toBe("fits");
    expect(fit.best).toBe("Schnakenberg");
    const s = fit.result!.models.find((m) => m.label === "Schnakenberg")!;
    expect(s.fit.parameters[0].value).toBeCloseTo(150, 0);
  });
});

describe("who may fit", () => {
  it("a collaborator may read a fit but not start or re-run one", async () => {
    const c = lab.w.people.collaborator;
    expect((await api("GET", `${FITS}/[fitId]`, { who: c, params: { fitId: first.id } })).status).toBe(200);
    expect((await api("POST", FITS, { who: c, json: roundTrip })).status).toBe(403);
    expect((await api("POST", `${FITS}/[fitId]/rerun`, { who: c, params: { fitId: first.id } })).status).toBe(403);
  });
});

describe("exports", () => {
  it("CSV parses into parameters and predictions with units in the column names", async () => {
    const r = await api("GET", `${FITS}/[fitId]/export`, { params: { fitId: first.id }, query: "format=csv" });
    expect(r.status).toBe(200);
    expect(r.res.headers.get("content-type")).toMatch(/text\/csv/);
    const text = await r.res.text();
    const sections = text.split(/\n(?=# )/);
    const params = Papa.parse<Record<string, string>>(
      sections
        .find((s) => s.startsWith("# parameters"))!
        .split("\n")
        .slice(1)
        .join("\n")
        .trim(),
      { header: true },
    );
    expect(params.errors).toEqual([]);
    expect(params.data.map((p) => p.condition)).toEqual(["control", "inhibitor"]);
    expect(Number(params.data[0].value)).toBeCloseTo(first.result!.models[0].fit.parameters[0].value, 6);
    const preds = Papa.parse<Record<string, string>>(
      sections
        .find((s) => s.startsWith("# predictions"))!
        .split("\n")
        .slice(1)
        .join("\n")
        .trim(),
      { header: true },
    );
    expect(preds.errors).toEqual([]);
    expect(preds.data).toHaveLength(4);
    expect(Object.keys(preds.data[0])).toContain("predicted_fourier_um");
  });

  it("JSON parses and holds spec, provenance and result; the methods paragraph cites the sources", async () => {
    const j = await api("GET", `${FITS}/[fitId]/export`, { params: { fitId: first.id }, query: "format=json" });
    const doc = JSON.parse(await j.res.text());
    expect(doc.inputSha256).toBe(first.inputSha256);
    expect(doc.spec.kinetics).toBe("schnakenberg");
    expect(doc.result.models[0].fit.parameters).toHaveLength(2);
    const t = await (
      await api("GET", `${FITS}/[fitId]/export`, { params: { fitId: first.id }, query: "format=methods" })
    ).res.text();
    for (const s of [
      "Schnakenberg J. (1979)",
      "Raue A. et al. (2009)",
      "Burnham K.P. & Anderson D.R. (2002)",
      "Levenberg–Marquardt",
      "µm",
      first.inputSha256,
    ])
      expect(t).toContain(s);
    expect(
      (await api("GET", `${FITS}/[fitId]/export`, { params: { fitId: first.id }, query: "format=pdf" })).status,
    ).toBe(400);
  });
});

describe("job-finish e-mail", () => {
  it("arrives for the requester of a job longer than JOB_MAIL_AFTER_S, and not when they turned e-mail off", async () => {
    const loud = await makePerson("modeller", lab.w.labId, "loud");
    const quiet = await makePerson("modeller", lab.w.labId, "quiet");
    await (await database()).User.update({ notifyByEmail: false }, { where: { id: quiet.userId } });
    const a = await startAndWait({ ...roundTrip, name: "Mailed", options: { profiles: false } }, loud);
    await startAndWait({ ...roundTrip, name: "Not mailed", options: { profiles: false } }, quiet);
    const mail = await waitForMailWithSubject(lab.stack.mailboxUrl, loud.email, "[Test Lab] The fit “Mailed” finished");
    expect(mail.text).toContain(`/labs/${lab.w.labId}/fits/${a.id}`);
    expect(await inbox(loud.email)).toHaveLength(1);
    expect(await inbox(quiet.email)).toEqual([]);
  });

  it("a mail server failure never changes the job's status", async () => {
    const real = lab.stack.services.mailer;
    let tried = 0;
    lab.stack.services.mailer = {
      send: async () => {
        tried++;
        throw new Error("mail server down");
      },
      check: real.check,
    };
    try {
      const fit = await startAndWait({ ...roundTrip, name: "Mail down", options: { profiles: false } });
      for (let i = 0; i < 50 && tried === 0; i++) await new Promise((r) => setTimeout(r, 50));
      expect(tried).toBe(1);
      expect((await waitForJob(fit.jobId!)).status).toBe("succeeded");
      expect(fit.status).toBe("succeeded");
    } finally {
      lab.stack.services.mailer = real;
    }
  });
});
