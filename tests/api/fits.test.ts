/**
 * Fits through the API: wavelengths generated from known Schnakenberg parameters are fitted back
 * within their 95 % intervals (round trip; the generating parameters are the source), one datum
 * with two free parameters is reported not identifiable, a comparison ranks the generating
 * kinetics first, every bad input is refused before a job starts, provenance is recorded, a
 * re-run reproduces the numbers, exports parse, and the job-finish e-mail arrives (or not).
 */
import { randomUUID } from "node:crypto";
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import packageJson from "@/package.json";
import { createKineticsPredictor } from "@/lib/fitting/kinetics-predictor";
import { getCatalogueKinetics } from "@/lib/kinetics";
import type { FitCreateInput } from "@/lib/contracts/fit";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import { numbersOf } from "@/lib/server/fits/result";
import { waitForJob } from "@/lib/server/jobs/queue";
import { database } from "@/lib/server/services";
import { call, discoverRoutes } from "../support/api";
import { waitForMailWithSubject } from "../support/mail";
import { startTestStack, type TestStack } from "../support/stack";
import { makePerson, makeWorld, type Person, type World } from "../support/world";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;

const FITS = "/api/v1/labs/[labId]/fits";
async function api(
  method: "GET" | "POST",
  path: string,
  o: { who?: Person; params?: Record<string, string>; json?: unknown; query?: string } = {},
) {
  const res = await call(routes.get(`${method} ${path}`)!, method, path, {
    token: (o.who ?? w.people.modeller).token,
    params: { labId: w.labId, ...o.params },
    json: o.json,
    query: o.query,
  });
  return { status: res.status, res };
}

/** Schnakenberg's 2π/k* in µm at ℓ = 40 µm (the generating model of every synthetic datum). */
const schnakenberg = createKineticsPredictor(getCatalogueKinetics("schnakenberg"), { lengthScaleUm: 40 });
const lambdaUm = (p: Record<string, number>) =>
  schnakenberg({ a: 0.1, b: 0.9, d: 20, ...p }, "", undefined)!.wavelengthUm;
// Generating parameters: γ = 180 (control), 120 (inhibitor); a = 0.1, b = 0.9, d = 20 fixed.
const TRUE_GAMMA = { control: 180, inhibitor: 120 };
const roundTripData = Object.entries(TRUE_GAMMA).flatMap(([condition, gamma]) => {
  const l = lambdaUm({ gamma });
  // Two measurements per condition, ±1 % around the model value (symmetric, so the mean is exact).
  return [0.99, 1.01].map((f) => ({
    condition,
    kind: "fourier" as const,
    wavelengthUm: l * f,
    uncertaintyUm: 0.02 * l,
  }));
});
const gammaPerCondition = { gamma: { mode: "per-condition" as const, start: 100, lower: 10, upper: 1000, log: true } };
const roundTrip: FitCreateInput = {
  name: "Round trip",
  data: roundTripData,
  models: [
    {
      kinetics: "schnakenberg",
      lengthScaleUm: 40,
      parameters: { ...gammaPerCondition, d: { mode: "fixed", value: 20 } },
    },
  ],
};

async function startAndWait(body: unknown, who?: Person): Promise<FitDetailDto> {
  const r = await api("POST", FITS, { json: body, who });
  expect(r.status, await r.res.clone().text()).toBe(202);
  const fit = (await r.res.json()) as FitDetailDto;
  const job = await waitForJob(fit.jobId!, 60_000);
  expect(job.status, job.error ?? "").toBe("succeeded");
  const got = await api("GET", `${FITS}/[fitId]`, { params: { fitId: fit.id }, who });
  return (await got.res.json()) as FitDetailDto;
}

async function inbox(email: string): Promise<{ subject: string; text: string }[]> {
  const res = await fetch(`${stack.mailboxUrl}/messages?to=${encodeURIComponent(email)}`);
  return ((await res.json()) as { messages: { subject: string; text: string }[] }).messages;
}

let first: FitDetailDto;

beforeAll(async () => {
  process.env.JOB_MAIL_AFTER_S = "0";
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
  first = await startAndWait(roundTrip);
}, 90_000);
afterAll(async () => {
  delete process.env.JOB_MAIL_AFTER_S;
  await stack?.close();
});

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

describe("readouts as data", () => {
  it("takes a readout's nearest-neighbour spacing, converts it and says so, and records the readout", async () => {
    const m = await database();
    const study = await m.Study.create({
      labId: w.labId,
      name: "Placodes",
      tissue: "skin",
      organism: "chick",
      description: null,
      createdBy: w.people.manager.userId,
    });
    const specimen = await m.Specimen.create({
      labId: w.labId,
      studyId: study.id,
      label: "DS-9",
      condition: "control",
      stage: null,
      genotype: null,
      notes: null,
      createdBy: w.people.manager.userId,
    });
    const upload = await m.Upload.create({
      id: randomUUID(),
      labId: w.labId,
      specimenId: specimen.id,
      filename: "spots.tif",
      storageKey: `test/${specimen.id}`,
      sizeBytes: 1,
      sha256: "a".repeat(64),
      kind: "image",
      contentType: "image/tiff",
      pixelSizeUm: 2,
      pixelSizeSource: "uploader",
      createdBy: w.people.manager.userId,
    } as never);
    // A finished readout of hexagonal spots: λ = 38.6 µm, a = (2/√3)·λ (SCIENCE.md §4).
    const lambda = lambdaUm({ gamma: 180 });
    const wavelength = {
      wavelengthUm: lambda,
      uncertaintyUm: 0.5,
      periodFound: true,
      significance: 40,
      symmetry: "hexagonal",
      nearestNeighbourUm: (2 / Math.sqrt(3)) * lambda,
    };
    const readout = await m.Readout.create({
      labId: w.labId,
      uploadId: upload.id,
      specimenId: specimen.id,
      jobId: null,
      status: "succeeded",
      kind: "image",
      settings: {},
      result: { type: "image", wavelength } as never,
      wavelengthUm: lambda,
      uncertaintyUm: 0.5,
      periodFound: true,
      pixelSizeUm: 2,
      inputSha256: "b".repeat(64),
      softwareVersion: "morphokin test",
      createdBy: w.people.manager.userId,
    });
    const fit = await startAndWait({
      name: "From a readout",
      data: [
        { readoutId: readout.id, kind: "nearest-neighbour" },
        {
          condition: "control",
          kind: "nearest-neighbour",
          wavelengthUm: (2 / Math.sqrt(3)) * lambda * 1.01,
          uncertaintyUm: 0.6,
        },
      ],
      models: [
        {
          kinetics: "schnakenberg",
          lengthScaleUm: 40,
          parameters: { gamma: { mode: "free", start: 100, lower: 10, upper: 1000, log: true } },
        },
      ],
    });
    const f = fit.result!.models[0].fit;
    expect(f.notes.join(" ")).toMatch(/converted to Fourier wavelengths as λ = \(√3\/2\)·a/);
    expect(f.residuals[0].measuredFourierUm).toBeCloseTo(lambda, 6);
    expect(f.parameters[0].interval95!.lower.value!).toBeLessThan(180);
    expect(f.parameters[0].interval95!.upper.value!).toBeGreaterThan(180);
    expect(fit.provenance.data[0]).toMatchObject({
      source: "readout",
      readoutId: readout.id,
      condition: "control",
      kind: "nearest-neighbour",
      inputSha256: "b".repeat(64),
      filename: "spots.tif",
      specimenLabel: "DS-9",
      studyName: "Placodes",
    });
  });
});

describe("bad input is refused before a job starts, naming the field", () => {
  const model = roundTrip.models[0];
  const refused = async (body: unknown) => {
    const before = await (await database()).Job.count();
    const r = await api("POST", FITS, { json: body });
    expect(await (await database()).Job.count()).toBe(before);
    return {
      status: r.status,
      error: ((await r.res.json()) as { error: { message: string; details?: { field?: string } } }).error,
    };
  };
  const cases: [string, unknown, number, string][] = [
    [
      "no data selected",
      { ...roundTrip, data: [] },
      400,
      "data: select at least one readout or type a measured wavelength",
    ],
    [
      "incompatible data kinds in one condition",
      { ...roundTrip, data: [roundTripData[0], { ...roundTripData[1], kind: "nearest-neighbour" }] },
      422,
      'data[1].kind is "nearest-neighbour" but condition "control" also has "fourier" measurements; use one kind per condition (the spacing conversion assumes hexagonal spots, which a condition mixing both kinds does not establish).',
    ],
    [
      "bounds that exclude the start",
      {
        ...roundTrip,
        models: [{ ...model, parameters: { gamma: { mode: "free", start: 5, lower: 10, upper: 1000 } } }],
      },
      422,
      "models[0].parameters.gamma.start (5) must lie within [lower, upper] = [10, 1000].",
    ],
    [
      "all parameters fixed",
      { ...roundTrip, models: [{ ...model, parameters: { gamma: { mode: "fixed", value: 100 } } }] },
      422,
      "models[0].parameters must leave at least one free parameter; all 4 are fixed.",
    ],
    [
      "no Turing region in the bounds",
      {
        ...roundTrip,
        models: [
          {
            ...model,
            parameters: {
              gamma: { mode: "free", start: 100, lower: 10, upper: 1000 },
              d: { mode: "free", start: 2, lower: 1, upper: 3 },
            },
          },
        ],
      },
      422,
      "models[0].parameters: no Turing region within the bounds of Schnakenberg: none of the 65 sampled points (the start and 64 seeded points in the box) is Turing-unstable in every condition; widen the bounds or free other parameters",
    ],
    [
      "an unknown parameter",
      { ...roundTrip, models: [{ ...model, parameters: { Du: { mode: "fixed", value: 1 } } }] },
      422,
      "models[0].parameters.Du: Schnakenberg has no parameter “Du” (its parameters: gamma, a, b, d; or lengthScaleUm, timeScaleS)",
    ],
    [
      "a non-dimensional kinetics without a length scale",
      { ...roundTrip, models: [{ kinetics: "schnakenberg", parameters: gammaPerCondition }] },
      422,
      "models[0].lengthScaleUm: Schnakenberg is non-dimensional; give a length scale ℓ (µm per model length) or fit lengthScaleUm as a parameter, so its wavelength can be compared in µm",
    ],
    [
      "a typed datum without its uncertainty",
      { ...roundTrip, data: [{ condition: "control", kind: "fourier", wavelengthUm: 40 }] },
      400,
      "data[0].uncertaintyUm: a typed measurement needs uncertaintyUm (or give a readoutId instead)",
    ],
    [
      "an unknown readout",
      { ...roundTrip, data: [{ readoutId: "00000000-0000-4000-8000-000000000000" }] },
      422,
      "data[0].readoutId: no readout with this id in this lab",
    ],
    [
      "an unknown kinetics",
      { ...roundTrip, models: [{ ...model, kinetics: "no-such-model" }] },
      422,
      "models[0].kinetics: no kinetics “no-such-model” in the catalogue or this lab",
    ],
  ];
  for (const [what, body, status, message] of cases) {
    it(what, async () => {
      const r = await refused(body);
      expect(r.status).toBe(status);
      expect(r.error.message).toBe(message);
    });
  }

  it("a collaborator may read a fit but not start or re-run one", async () => {
    const c = w.people.collaborator;
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
    const loud = await makePerson("modeller", w.labId, "loud");
    const quiet = await makePerson("modeller", w.labId, "quiet");
    await (await database()).User.update({ notifyByEmail: false }, { where: { id: quiet.userId } });
    const a = await startAndWait({ ...roundTrip, name: "Mailed", options: { profiles: false } }, loud);
    await startAndWait({ ...roundTrip, name: "Not mailed", options: { profiles: false } }, quiet);
    const mail = await waitForMailWithSubject(stack.mailboxUrl, loud.email, "[Test Lab] The fit “Mailed” finished");
    expect(mail.text).toContain(`/labs/${w.labId}/fits/${a.id}`);
    expect(await inbox(loud.email)).toHaveLength(1);
    expect(await inbox(quiet.email)).toEqual([]);
  });

  it("a mail server failure never changes the job's status", async () => {
    const real = stack.services.mailer;
    let tried = 0;
    stack.services.mailer = {
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
      stack.services.mailer = real;
    }
  });
});
