/**
 * Lab kinetics through the API (create, versions, edit, delete, audit, exact validation messages)
 * and the catalogue.
 */
import { describe, expect, it } from "vitest";
import { database } from "@/lib/server/services";
import { setupLabApi } from "../support/lab-api";
import { labSchnakenberg } from "./permission-cases/kinetics";

const lab = setupLabApi({ who: "modeller" });
const api = lab.api;
const KIN = "/api/v1/labs/[labId]/kinetics";
const ONE = "/api/v1/labs/[labId]/kinetics/[kineticsId]";

describe("catalogue", () => {
  it("lists the published kinetics with species, parameter ranges and source", async () => {
    const res = await lab.raw("GET", "/api/v1/kinetics", { who: "collaborator" });
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
    const one = await lab.raw("GET", "/api/v1/kinetics/[kineticsId]", {
      who: "scientist",
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
      createdByEmail: lab.w.people.modeller.email,
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
      await m.AuditEvent.findAll({ where: { labId: lab.w.labId, targetId: id }, order: [["createdAt", "asc"]] })
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
      'Equation for du/dt: unknown symbol "w" (species: u, v; parameters: a, b, d; constants: pi, e).',
    ],
    [
      "one reaction too many",
      { reactions: ["a - u", "b - v", "u"] },
      400,
      "Equations: 3 given but there are 2 species; give one reaction term per species.",
    ],
    [
      "a diffusion list of the wrong length",
      { diffusion: [1, 2, 3] },
      400,
      "Diffusion: 3 diagonal entries given but there are 2 species.",
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
      "Parameter a: default 20 is outside [0, 10].",
    ],
    [
      "no steady state",
      { reactions: ["1 + u^2", "1 + v^2"] },
      422,
      "Parameters: no steady state at the default parameter values — No homogeneous steady state: Newton's method from 53 seeded starting points found no non-negative solution.",
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
    expect(parse.body.error.message).toMatch(/^Equation for du\/dt does not parse: /);
    expect(parse.body.error.details).toEqual({ field: "definition.reactions[0]" });
    const one = await api("POST", KIN, { json: { definition: { ...labSchnakenberg(), species: ["u"] } } });
    expect(one.body.error.message).toBe("Species: give at least 2 species");
    const text = await api("POST", KIN, {
      json: { definition: { ...labSchnakenberg(), parameters: [{ name: "a", default: "NaN" }] } },
    });
    expect(text.status).toBe(400);
    expect(text.body.error.message).toMatch(/^Default of parameter a: /);
  });
});
