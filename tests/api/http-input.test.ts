/**
 * Input handling through the API: names that exist on every JavaScript object are no kinetics
 * symbols, deep nesting is refused naming the limit, a negative diffusivity is refused naming the
 * field, search text matches `%` and `_` literally and ignores letter case, and no message repeats its field prefix.
 * Expected messages are the product's own (common practice, no source).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MAX_FIT_DATA } from "@/lib/contracts/fit";
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

async function api(
  method: Method,
  path: string,
  o: { params?: Record<string, string>; json?: unknown; query?: string } = {},
) {
  const res = await call(routes.get(`${method} ${path}`)!, method, path, {
    token: w.people.modeller.token,
    params: { labId: w.labId, ...o.params },
    json: o.json,
    query: o.query,
  });
  return { status: res.status, body: await res.json() };
}
const KIN = "/api/v1/labs/[labId]/kinetics";
const SPECIES = "species: u, v; parameters: a, b, d; constants: pi, e";

describe("kinetics expressions", () => {
  it.each(["constructor", "toString", "__proto__", "valueOf", "hasOwnProperty"])(
    "%s is an unknown symbol, not a prototype property",
    async (name) => {
      const r = await api("POST", KIN, {
        json: {
          definition: { ...labSchnakenberg(`Proto ${name}`), reactions: [`a - u + u^2 * v + ${name}`, "b - u^2 * v"] },
        },
      });
      expect(r.status).toBe(400);
      expect(r.body.error.message).toBe(`Equation for du/dt: unknown symbol "${name}" (${SPECIES}).`);
    },
  );

  it("995 nested brackets are a 400 naming the limit, not a stack overflow", async () => {
    const deep = "(".repeat(995) + "u" + ")".repeat(995);
    const r = await api("POST", KIN, {
      json: { definition: { ...labSchnakenberg("Deep"), reactions: ["a - u + u^2 * v", deep] } },
    });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toBe("Equation for dv/dt nests brackets 995 levels deep; the limit is 50 levels.");
  });

  it("a negative diffusivity is refused naming the field", async () => {
    const neg = await api("POST", KIN, {
      json: { definition: { ...labSchnakenberg("Negative"), diffusion: [-1, "d"] } },
    });
    expect(neg.status).toBe(400);
    expect(neg.body.error.message).toBe("Diffusivity of u is -1; a diffusivity must be 0 or more.");
    const expr = await api("POST", KIN, {
      json: { definition: { ...labSchnakenberg("Negative expr"), diffusion: [1, "1 - d"] } },
    });
    expect(expr.status).toBe(400);
    expect(expr.body.error.message).toBe(
      "Diffusivity of v = 1 - d is -19 at the default parameters; a diffusivity must be 0 or more.",
    );
  });
});

describe("search text", () => {
  it("?q=_ and ?q=% match an underscore and a percent sign literally", async () => {
    for (const name of ["Snake_case", "Plain study", "Half 50% dose", "Quote's study"]) {
      expect(
        (await api("POST", "/api/v1/labs/[labId]/studies", { json: { name, tissue: "skin", organism: "chick" } }))
          .status,
      ).toBe(201);
    }
    const names = async (q: string) =>
      (
        (await api("GET", "/api/v1/labs/[labId]/studies", { query: `q=${encodeURIComponent(q)}` })).body.items as {
          name: string;
        }[]
      )
        .map((s) => s.name)
        .sort();
    expect(await names("_")).toEqual(["Snake_case"]);
    expect(await names("%")).toEqual(["Half 50% dose"]);
    expect(await names("e_c")).toEqual(["Snake_case"]);
    expect(await names("'")).toEqual(["Quote's study"]);
    expect(await names("!")).toEqual([]);
  });

  it("search ignores the case of letters, on SQLite and on PostgreSQL alike", async () => {
    // Expected: what SQLite's LIKE already did for ASCII letters (product rule, no source).
    for (const name of ["Zebrafish FIN rays", "zebrafish fin rays (repeat)"]) {
      const res = await api("POST", "/api/v1/labs/[labId]/studies", {
        json: { name, tissue: "fin", organism: "fish" },
      });
      expect(res.status).toBe(201);
    }
    for (const q of ["fin RAYS", "ZEBRAFISH FIN", "Fin Rays"]) {
      const res = await api("GET", "/api/v1/labs/[labId]/studies", { query: `q=${encodeURIComponent(q)}` });
      expect((res.body.items as { name: string }[]).map((s) => s.name).sort()).toEqual([
        "Zebrafish FIN rays",
        "zebrafish fin rays (repeat)",
      ]);
    }
  });

  it("a control character in the search text is a 400 saying so", async () => {
    const r = await api("GET", "/api/v1/labs/[labId]/studies", { query: "q=%00" });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toBe("q: remove control characters from the search text");
  });
});

describe("messages say their field once", () => {
  it(`more than ${MAX_FIT_DATA} fit data: "data: at most …", not "data: data: …"`, async () => {
    const datum = { condition: "c", kind: "fourier", wavelengthUm: 100, uncertaintyUm: 2 };
    const r = await api("POST", "/api/v1/labs/[labId]/fits", {
      json: {
        name: "Many",
        data: Array.from({ length: MAX_FIT_DATA + 1 }, () => datum),
        models: [{ kinetics: "schnakenberg", lengthScaleUm: 40, parameters: {} }],
      },
    });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toBe(`Measurements: at most ${MAX_FIT_DATA} measurements`);
  });

  it("a nested field: The first kinetics: at most 64 characters", async () => {
    const r = await api("POST", "/api/v1/labs/[labId]/fits", {
      json: {
        name: "Long",
        data: [{ condition: "c", kind: "fourier", wavelengthUm: 100, uncertaintyUm: 2 }],
        models: [{ kinetics: "k".repeat(65), parameters: {} }],
      },
    });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toBe("The first kinetics: at most 64 characters");
  });

  it("a run: Kinetics: at most 64 characters; Simulated time must be above 0 (once each)", async () => {
    const r = await api("POST", "/api/v1/labs/[labId]/runs", {
      json: { kinetics: "k".repeat(65), grid: { lengthUm: [100], cells: [64] }, endTimeS: -1 },
    });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toBe("Kinetics: at most 64 characters; Simulated time must be above 0");
  });

  it("the fit export's format: said once", async () => {
    const R = "/api/v1/labs/[labId]/fits/[fitId]/export";
    const res = await call(routes.get(`GET ${R}`)!, "GET", R, {
      token: w.people.modeller.token,
      params: { labId: w.labId, fitId: "00000000-0000-4000-8000-000000000000" },
      query: "format=xls",
    });
    expect(res.status).toBe(400);
    expect((await res.json()).error.message).toBe('format must be "csv", "json" or "methods"');
  });
});
