/**
 * Every API route × every role × own lab / another lab / signed out, against the permission
 * table in PRODUCT.md ("common practice, no source": expected statuses are the product rules).
 * Cases live in ./permission-cases/*.ts, one file per area. A route file that is not listed
 * there makes the first test fail.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ROLES } from "@/lib/access/roles";
import { readdirSync } from "node:fs";
import path from "node:path";
import { createStudy } from "@/lib/server/studies/studies";
import { call, discoverRoutes, type Method } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";
import { study, type Case, type Who } from "./permission-cases/shared";

const CASES: Record<string, Case> = {};
const casesDir = path.join(import.meta.dirname, "permission-cases");
for (const f of readdirSync(casesDir)
  .filter((x) => x.endsWith(".ts") && x !== "shared.ts")
  .sort()) {
  const mod = (await import(path.join(casesDir, f))) as { cases: Record<string, Case> };
  for (const [k, v] of Object.entries(mod.cases)) {
    if (CASES[k]) throw new Error(`${k} is listed in two permission-case files`);
    CASES[k] = v;
  }
}

let stack: TestStack;
let world: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;

beforeAll(async () => {
  stack = await startTestStack();
  world = await makeWorld();
  routes = await discoverRoutes();
});
afterAll(async () => stack?.close());

describe("permission matrix", () => {
  it("lists every API route file and method (a new route must be added here)", () => {
    expect([...routes.keys()].sort()).toEqual(Object.keys(CASES).sort());
  });

  const WHO: Who[] = [...ROLES, "outsider", "anonymous"];
  for (const [key, c] of Object.entries(CASES)) {
    it(`${key}: ${WHO.map((w) => `${w} ${c.expect[w]}`).join(", ")}`, async () => {
      const [method, path] = key.split(" ") as [Method, string];
      const got: Partial<Record<Who, number>> = {};
      for (const who of WHO) {
        const s = await c.setup(world, who);
        const token =
          who === "anonymous" ? undefined : who === "outsider" ? world.outsider.token : world.people[who].token;
        const res = await call(routes.get(key)!, method, path, {
          token,
          params: s.params,
          json: s.json,
          body: s.form,
          query: s.query,
        });
        got[who] = res.status;
        if (process.env.DEBUG_MATRIX && res.status >= 400) console.log(key, who, await res.clone().text());
      }
      expect(got).toEqual(c.expect);
      // Some setups run a real job (a simulation in a child process): generous on a loaded 2-core machine.
    }, 120_000);
  }
});

describe("ownership", () => {
  it("a bench scientist may edit and delete their own study but not the manager's", async () => {
    const own = await createStudy(
      { actor: world.people.scientist.actor, labId: world.labId, labName: "Test Lab", role: "scientist" },
      { name: "Own", tissue: "skin", organism: "chick", description: null },
    );
    const patch = routes.get("PATCH /api/v1/labs/[labId]/studies/[studyId]")!;
    const del = routes.get("DELETE /api/v1/labs/[labId]/studies/[studyId]")!;
    const t = world.people.scientist.token;
    expect(
      (
        await call(patch, "PATCH", "/api/v1/labs/[labId]/studies/[studyId]", {
          token: t,
          params: { labId: world.labId, studyId: own.id },
          json: { name: "Own renamed" },
        })
      ).status,
    ).toBe(200);
    expect(
      (
        await call(del, "DELETE", "/api/v1/labs/[labId]/studies/[studyId]", {
          token: t,
          params: { labId: world.labId, studyId: own.id },
        })
      ).status,
    ).toBe(204);
    const theirs = await study(world);
    const res = await call(patch, "PATCH", "/api/v1/labs/[labId]/studies/[studyId]", {
      token: t,
      params: { labId: world.labId, studyId: theirs.id },
      json: { name: "x" },
    });
    expect(res.status).toBe(403);
    expect((await res.json()).error.message).toBe("only its creator or a lab manager may change or delete this");
  });

  it("an id from another lab answers 404 even to that lab's manager when asked under this lab", async () => {
    const get = routes.get("GET /api/v1/labs/[labId]/studies/[studyId]")!;
    const s = await study(world);
    const res = await call(get, "GET", "/api/v1/labs/[labId]/studies/[studyId]", {
      token: world.outsider.token,
      params: { labId: world.otherLabId, studyId: s.id },
    });
    expect(res.status).toBe(404);
  });
});
