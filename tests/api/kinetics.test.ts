/**
 * Lab kinetics (create, versions, edit, delete, audit, exact validation messages) and the analyses
 * endpoints, with numbers checked against published closed forms.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { database } from "@/lib/server/services";
import { call, discoverRoutes, type Method } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";
import { labSchnakenberg } from "./permission-cases/kinetics";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
});
afterAll(async () => stack?.close());

type Who = "manager" | "scientist" | "modeller" | "collaborator";
async function api(
  method: Method,
  path: string,
  o: { who?: Who; params?: Record<string, string>; json?: unknown; query?: string } = {},
) {
  const res = await call(routes.get(`${method} ${path}`)!, method, path, {
    token: w.people[o.who ?? "modeller"].token,
    params: { labId: w.labId, ...o.params },
    json: o.json,
    query: o.query,
  });
  return { status: res.status, body: res.status === 204 ? null : await res.json() };
}
const KIN = "/api/v1/labs/[labId]/kinetics";
const ONE = "/api/v1/labs/[labId]/kinetics/[kineticsId]";
const analysis = (name: string, json: unknown) => api("POST", `/api/v1/labs/[labId]/analyses/${name}`, { json });

describe("catalogue", () => {
  it("lists the published kinetics with species, parameter ranges and source", async () => {
    const res = await call(routes.get("GET /api/v1/kinetics")!, "GET", "/api/v1/kinetics", {
      token: w.people.collaborator.token,
    });
    const items = (await res.json()).items as {
      id: string;
      species: string[];
      source: string;
      parameters: { name: string; min: number; max: number }[];
    }[];
    const s = items.find((k) => k.id === "schnakenberg")!;
    expect(s.species).toEqual(["u", "v"]);
    expect(s.source).toContain("Schnakenberg J. (1979)");
    expect(s.parameters.find((p) => p.name === "a")).toMatchObject({ min: 0, max: 100 });
    const one = await call(routes.get("GET /api/v1/kinetics/[kineticsId]")!, "GET", "/api/v1/kinetics/[kineticsId]", {
      token: w.people.scientist.token,
      params: { kineticsId: "no-such" },
    });
    expect(one.status).toBe(404);
  });
});

describe("lab kinetics", () => {
  it("creates version 1, saves edits as new versions, keeps old ones, and audits create/edit/delete", async () => {
    const created = await api("POST", KIN, {
      json: { description: "expression form", definition: labSchnakenberg("Mine") },
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      name: "Mine",
      latestVersion: 1,
      species: ["u", "v"],
      canEdit: true,
      createdByEmail: w.people.modeller.email,
    });
    const id = created.body.id as string;
    const edited = await api("PATCH", ONE, {
      params: { kineticsId: id },
      json: { definition: { ...labSchnakenberg("Mine v2"), reactions: ["a - u + u^2 * v", "b - u^2 * v + 0"] } },
    });
    expect(edited.body).toMatchObject({ name: "Mine v2", latestVersion: 2 });
    const versions = await api("GET", `${ONE}/versions`, { who: "collaborator", params: { kineticsId: id } });
    expect(versions.body.items.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    const v1 = await api("GET", ONE, { who: "scientist", params: { kineticsId: id }, query: "version=1" });
    expect(v1.body.definition.name).toBe("Mine");
    expect(v1.body.info.parameters.map((p: { name: string }) => p.name)).toEqual(["a", "b", "d"]);
    expect((await api("GET", ONE, { params: { kineticsId: id }, query: "version=7" })).status).toBe(404);
    expect((await api("DELETE", ONE, { params: { kineticsId: id } })).status).toBe(204);
    expect((await api("GET", ONE, { params: { kineticsId: id } })).status).toBe(404);
    const m = await database();
    const actions = (
      await m.AuditEvent.findAll({ where: { labId: w.labId, targetId: id }, order: [["createdAt", "asc"]] })
    ).map((e) => e.action);
    expect(actions).toEqual(["kinetics.created", "kinetics.edited", "kinetics.deleted"]);
    expect(await m.KineticsVersion.count({ where: { kineticsId: id } })).toBe(0);
  });

  it("a modeller may not edit another modeller's or the manager's kinetics; the manager may edit the modeller's", async () => {
    const mine = (await api("POST", KIN, { json: { definition: labSchnakenberg("Modeller's") } })).body;
    const theirs = (await api("POST", KIN, { who: "manager", json: { definition: labSchnakenberg("Manager's") } }))
      .body;
    const denied = await api("PATCH", ONE, {
      params: { kineticsId: theirs.id },
      json: { definition: labSchnakenberg("x") },
    });
    expect(denied).toEqual({
      status: 403,
      body: { error: { code: "forbidden", message: "only its creator or a lab manager may change or delete this" } },
    });
    expect(
      (
        await api("PATCH", ONE, {
          who: "manager",
          params: { kineticsId: mine.id },
          json: { definition: labSchnakenberg("Managed") },
        })
      ).body.latestVersion,
    ).toBe(2);
    const list = await api("GET", KIN, { who: "collaborator", query: "sort=name&dir=asc" });
    expect(list.body.items.filter((k: { canEdit: boolean }) => k.canEdit)).toEqual([]);
  });

  // Exact sentences from the compiler and the route (common practice, no source).
  it.each([
    [
      "an unknown symbol",
      { reactions: ["a - u + u^2 * w", "b - u^2 * v"] },
      400,
      'definition.reactions[0]: unknown symbol "w" (species: u, v; parameters: a, b, d; constants: pi, e).',
    ],
    [
      "one reaction too many",
      { reactions: ["a - u", "b - v", "u"] },
      400,
      "definition.reactions has 3 entries but there are 2 species; give one reaction term per species.",
    ],
    [
      "a diffusion list of the wrong length",
      { diffusion: [1, 2, 3] },
      400,
      "definition.diffusion has 3 diagonal entries but there are 2 species.",
    ],
    [
      "a default outside its range",
      {
        parameters: [
          { name: "a", default: 20, min: 0, max: 10 },
          { name: "b", default: 0.9 },
          { name: "d", default: 20 },
        ],
      },
      400,
      "definition.parameters[0].default: Parameter a: default 20 is outside [0, 10].",
    ],
    [
      "no steady state",
      { reactions: ["1 + u^2", "1 + v^2"] },
      422,
      "definition: no steady state at the default parameter values — No homogeneous steady state: Newton's method from 53 seeded starting points found no non-negative solution.",
    ],
  ])("refuses %s", async (_what, change, status, message) => {
    const res = await api("POST", KIN, { json: { definition: { ...labSchnakenberg(), ...change } } });
    expect(res.status).toBe(status);
    expect(res.body.error.message).toBe(message);
  });

  it("names the field of a parse error, a single species and a value sent as text", async () => {
    const parse = await api("POST", KIN, {
      json: { definition: { ...labSchnakenberg(), reactions: ["a - u +* v", "b"] } },
    });
    expect(parse.status).toBe(400);
    expect(parse.body.error.message).toMatch(/^definition\.reactions\[0\] does not parse: /);
    expect(parse.body.error.details).toEqual({ field: "definition.reactions[0]" });
    const one = await api("POST", KIN, { json: { definition: { ...labSchnakenberg(), species: ["u"] } } });
    expect(one.body.error.message).toBe("definition.species: Too small: expected array to have >=2 items");
    const text = await api("POST", KIN, {
      json: { definition: { ...labSchnakenberg(), parameters: [{ name: "a", default: "NaN" }] } },
    });
    expect(text.status).toBe(400);
    expect(text.body.error.message).toMatch(/^definition\.parameters\.0\.default: /);
  });
});

describe("analyses", () => {
  it("Schnakenberg: critical ratio d_c of Murray's quadratic, Turing above it, stable below, λ in µm = ℓ·2π/k*", async () => {
    // Murray (2003) Mathematical Biology II §2.4: at a = 0.1, b = 0.9, d_c is the root of
    // 0.64 d² − 5.6 d + 1 = 0 with d f_u + g_v > 0 (hand-computed, as in tests/lib/stability).
    const dc = (5.6 + Math.sqrt(5.6 ** 2 - 4 * 0.64)) / 1.28;
    const r = await analysis("dispersion", {
      kinetics: "schnakenberg",
      parameters: { a: 0.1, b: 0.9, d: 20 },
      lengthScaleUm: 10,
    });
    expect(r.status).toBe(200);
    expect(r.body.classification.classes).toEqual(["turing"]);
    expect(r.body.turingConditions.criticalRatio).toBeCloseTo(dc, 10);
    expect(r.body.turingConditions.conditions.every((c: { satisfied: boolean }) => c.satisfied)).toBe(true);
    // u* = a + b, v* = b/(a + b)² (Murray 2003 eq. 2.39)
    expect(r.body.steadyState.values.u).toBeCloseTo(1, 12);
    expect(r.body.steadyState.values.v).toBeCloseTo(0.9, 12);
    expect(r.body.fastest.wavelengthUm).toBeCloseTo((10 * 2 * Math.PI) / r.body.fastest.kStar, 10); // SCIENCE.md §3
    const below = await analysis("dispersion", { kinetics: "schnakenberg", parameters: { d: 0.9 * dc } });
    expect(below.body.classification.classes).toEqual(["stable"]);
    expect(below.body.fastest).toBeNull();
  });

  it("Brusselator just above b_c = (1 + a√(Du/Dv))² grows at k_c² = a/√(Du Dv) (Prigogine & Lefever 1968)", async () => {
    const a = 1.5,
      Du = 1,
      Dv = 10;
    const bc = (1 + a * Math.sqrt(Du / Dv)) ** 2;
    const r = await analysis("dispersion", { kinetics: "brusselator", parameters: { a, b: bc * (1 + 1e-8), Du, Dv } });
    expect(r.body.classification.classes).toEqual(["turing"]);
    expect(r.body.fastest.kStar).toBeCloseTo(Math.sqrt(a / Math.sqrt(Du * Dv)), 3);
  });

  it("on an interval of length L the admissible modes are k_n = nπ/L (SCIENCE.md §2) and the fastest is among them", async () => {
    const r = await analysis("dispersion", {
      kinetics: "schnakenberg",
      domain: { kind: "interval", length: 50, units: "model" },
    });
    const ks = r.body.admissibleModes.map((m: { k: number }) => m.k);
    ks.slice(0, 5).forEach((k: number, i: number) => expect(k).toBeCloseTo(((i + 1) * Math.PI) / 50, 12));
    const best = r.body.admissibleModes.reduce((x: { sigma: number }, y: { sigma: number }) =>
      y.sigma > x.sigma ? y : x,
    );
    expect(r.body.domain.fastestMode.k).toBeCloseTo(best.k, 12);
    expect(r.body.domain.fastestMode.sigma).toBeCloseTo(best.sigma, 8);
  });

  it("a lab kinetics at a version gives the catalogue's numbers for the same equations (round trip)", async () => {
    const k = (await api("POST", KIN, { json: { definition: labSchnakenberg("Round trip") } })).body;
    const lab = await analysis("dispersion", { kinetics: k.id, version: 1 });
    const cat = await analysis("dispersion", { kinetics: "schnakenberg" });
    expect(lab.body.info).toMatchObject({ kind: "lab", version: 1 });
    expect(lab.body.fastest.kStar).toBeCloseTo(cat.body.fastest.kStar, 8);
    expect((await analysis("dispersion", { kinetics: k.id, version: 2 })).status).toBe(404);
  });

  it("a three-species lab kinetics with cross-diffusion (full matrix) is saved and analysed by the general eigenvalue path", async () => {
    // The Brusselator of the catalogue plus a third, inert species coupled through cross-diffusion only
    // in the third row: its growth rates must equal the catalogue Brusselator's (block-triangular J − k²D, linear algebra).
    const definition = {
      name: "Brusselator + tracer",
      species: ["u", "v", "w"],
      parameters: [
        { name: "a", default: 1.5, min: 0.01, max: 10 },
        { name: "b", default: 2.5, min: 0, max: 100 },
      ],
      reactions: ["a - (b + 1) * u + u^2 * v", "b * u - u^2 * v", "1 - w"],
      diffusion: [
        [1, 0, 0],
        [0, 10, 0],
        [0.5, 0, 1],
      ],
    };
    const k = await api("POST", KIN, { json: { definition } });
    expect(k.status).toBe(201);
    const lab = await analysis("dispersion", { kinetics: k.body.id });
    const cat = await analysis("dispersion", {
      kinetics: "brusselator",
      parameters: { a: 1.5, b: 2.5, Du: 1, Dv: 10 },
    });
    expect(lab.body.turingConditions).toBeNull();
    expect(lab.body.classification.classes).toEqual(cat.body.classification.classes);
    expect(lab.body.fastest.kStar).toBeCloseTo(cat.body.fastest.kStar, 5);
  });

  it("Turing map: cells agree with the dispersion relation at their parameters, fraction and target cells are reported", async () => {
    const r = await analysis("turing-map", {
      kinetics: "schnakenberg",
      x: { name: "a", min: 0.02, max: 0.4, n: 12 },
      y: { name: "b", min: 0.2, max: 2, n: 10, scale: "log" },
      wavenumbers: 64,
      target: { wavelength: 13, tolerance: 2 },
    });
    expect(r.status).toBe(200);
    const { nx, classes, wavelength, x, y, turingFraction, counts, target } = r.body;
    expect(turingFraction).toBeCloseTo(counts.turing / (nx * r.body.ny), 12);
    expect(turingFraction).toBeGreaterThan(0);
    const i = classes.findIndex((c: number) => c === 1);
    const d = await analysis("dispersion", {
      kinetics: "schnakenberg",
      parameters: { a: x.values[i % nx], b: y.values[Math.floor(i / nx)] },
    });
    expect(d.body.classification.classes).toEqual(["turing"]);
    expect(wavelength[i]).toBeCloseTo(d.body.fastest.wavelength, 4);
    expect(target.matchCount).toBe(target.match.filter((m: number) => m === 1).length);
  });

  it("sensitivities: ∂ln λ*/∂ln γ = −1/2 and λ* halves when γ is scaled by 4 (λ ∝ √(D/γ), SCIENCE.md §3)", async () => {
    const r = await analysis("sensitivities", { kinetics: "schnakenberg", scale: { name: "gamma", factor: 4 } });
    expect(r.body.elasticities.elasticities.find((e: { name: string }) => e.name === "gamma").elasticity).toBeCloseTo(
      -0.5,
      5,
    );
    expect(r.body.scaled.ratio).toBeCloseTo(0.5, 10);
    const stable = await analysis("sensitivities", { kinetics: "schnakenberg", parameters: { d: 2 } });
    expect(stable.body).toMatchObject({
      elasticities: null,
      reason: "No mode at k > 0 grows here (stable), so the predicted wavelength and its elasticities are undefined.",
    });
  });

  it("gradient: patterning starts where a linear d(x) crosses d_c (Murray's quadratic), also from a pasted table", async () => {
    const xc = ((8.567627 - 2) / 38) * 1000;
    const lin = await analysis("gradient", {
      kinetics: "schnakenberg",
      parameter: "d",
      profile: { kind: "linear", from: 2, to: 40 },
      length: 1000,
      samples: 201,
      lengthScaleUm: 10,
    });
    expect(Math.abs(lin.body.patterningRegions[0].from - xc)).toBeLessThanOrEqual(5); // one sample spacing
    const table = await analysis("gradient", {
      kinetics: "schnakenberg",
      parameter: "d",
      profile: { kind: "table", text: "position,value\n0,2\n1000,40\n" },
      length: 1000,
      samples: 201,
      lengthScaleUm: 10,
    });
    expect(table.body.patterningRegions).toEqual(lin.body.patterningRegions);
  });

  // Exact sentences naming the field and the limit (common practice, no source).
  it.each([
    [
      "a value sent as text",
      "dispersion",
      { kinetics: "schnakenberg", parameters: { a: "NaN" } },
      400,
      'parameters.a: each parameter value must be a finite number (text such as "NaN" is not a number)',
    ],
    [
      "a parameter out of range",
      "dispersion",
      { kinetics: "schnakenberg", parameters: { a: 500 } },
      400,
      "Parameter a = 500 is outside its allowed range [0, 100].",
    ],
    [
      "an unknown kinetics",
      "dispersion",
      { kinetics: "turing-1952" },
      400,
      'Unknown kinetics "turing-1952"; the catalogue has: schnakenberg, gierer-meinhardt, gierer-meinhardt-saturation, brusselator, lengyel-epstein, fitzhugh-nagumo, thomas, gray-scott, brusselator-three-species.',
    ],
    [
      "no steady state",
      "dispersion",
      { kinetics: "schnakenberg", parameters: { a: 0, b: 0 } },
      422,
      "No homogeneous steady state: the closed form of Schnakenberg has no non-negative solution for these parameters.",
    ],
    [
      "a negative domain",
      "dispersion",
      { kinetics: "schnakenberg", domain: { kind: "interval", length: -3 } },
      400,
      "domain.length must be above 0",
    ],
    [
      "a map too large",
      "turing-map",
      { kinetics: "schnakenberg", x: { name: "a", min: 0, max: 1, n: 201 }, y: { name: "b", min: 0, max: 1, n: 200 } },
      413,
      "x.n × y.n = 40200 cells; an interactive map has at most 40000 cells (e.g. 200 × 200).",
    ],
    [
      "too many wavenumbers",
      "turing-map",
      {
        kinetics: "schnakenberg",
        x: { name: "a", min: 0, max: 1, n: 5 },
        y: { name: "b", min: 0, max: 1, n: 5 },
        wavenumbers: 500,
      },
      413,
      "wavenumbers: 500 asked; an interactive map has at most 200 per cell.",
    ],
    [
      "one parameter on both axes",
      "turing-map",
      { kinetics: "schnakenberg", x: { name: "a", min: 0, max: 1, n: 5 }, y: { name: "a", min: 0, max: 1, n: 5 } },
      400,
      'The two axes sweep the same parameter "a"; choose two different parameters.',
    ],
    [
      "a map over the time limit",
      "turing-map",
      {
        kinetics: "brusselator-three-species",
        x: { name: "a", min: 1, max: 3, n: 200 },
        y: { name: "b", min: 5, max: 15, n: 200 },
        wavenumbers: 200,
      },
      422,
      "The Turing map exceeded its time limit of 1000 ms.",
    ],
    [
      "too many gradient samples",
      "gradient",
      {
        kinetics: "schnakenberg",
        parameter: "d",
        profile: { kind: "linear", from: 2, to: 40 },
        length: 10,
        samples: 500,
      },
      413,
      "samples: 500 positions asked; the limit is 201.",
    ],
    [
      "a bad table row",
      "gradient",
      { kinetics: "schnakenberg", parameter: "d", profile: { kind: "table", text: "0,2\n5;x\n" }, length: 10 },
      400,
      'profile.text line 2: expected two numbers "position,value" (got “5;x”)',
    ],
  ])("refuses %s", async (_what, name, body, status, message) => {
    const r = await analysis(name, body);
    expect(r.status).toBe(status);
    expect(r.body.error.message).toBe(message);
  });

  it("a lab kinetics of another lab is not found", async () => {
    const k = (await api("POST", KIN, { json: { definition: labSchnakenberg("Private") } })).body;
    const path = "/api/v1/labs/[labId]/analyses/dispersion";
    const res = await call(routes.get(`POST ${path}`)!, "POST", path, {
      token: w.outsider.token,
      params: { labId: w.otherLabId },
      json: { kinetics: k.id },
    });
    expect(res.status).toBe(404);
  });
});
