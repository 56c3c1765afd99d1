/**
 * Every API route × every role × own lab / another lab / signed out, against the permission
 * table in PRODUCT.md ("common practice, no source": expected statuses are the product rules).
 * A route file that is not listed in CASES makes the first test fail.
 */
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { ROLES, type Role } from "@/lib/access/roles";
import type { LabContext } from "@/lib/server/access";
import { createSpecimen } from "@/lib/server/data/specimens";
import { createStudy } from "@/lib/server/data/studies";
import { newSecret, sha256Hex } from "@/lib/server/secrets";
import { database } from "@/lib/server/services";
import { call, discoverRoutes, multipart, type Method } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { makePerson, makeWorld, type World } from "../support/world";

vi.mock("next-auth", async (original) => ({ ...(await original<typeof import("next-auth")>()), getServerSession: async () => null }));

type Who = Role | "outsider" | "anonymous";
type Expect = Record<Who, number>;
interface Setup {
  params?: Record<string, string>;
  json?: unknown;
  form?: FormData;
  query?: string;
}
interface Case {
  setup: (w: World, who: Who) => Promise<Setup>;
  expect: Expect;
}

const ALL = (s: number, outsider = 404, anonymous = 401): Expect => ({ manager: s, scientist: s, modeller: s, collaborator: s, outsider, anonymous });
const MANAGER_ONLY = (s: number): Expect => ({ manager: s, scientist: 403, modeller: 403, collaborator: 403, outsider: 404, anonymous: 401 });
const NOT_COLLAB = (s: number): Expect => ({ manager: s, scientist: s, modeller: s, collaborator: 403, outsider: 404, anonymous: 401 });
const USER = (s: number): Expect => ({ manager: s, scientist: s, modeller: s, collaborator: s, outsider: s, anonymous: 401 });
const PUBLIC = (s: number): Expect => ({ manager: s, scientist: s, modeller: s, collaborator: s, outsider: s, anonymous: s });

let png: Uint8Array;
let seq = 0;
const managerCtx = (w: World): LabContext => ({ actor: w.people.manager.actor, labId: w.labId, labName: "Test Lab", role: "manager" });
const study = async (w: World) => createStudy(managerCtx(w), { name: `S${++seq}`, tissue: "skin", organism: "chick", description: null });
const specimen = async (w: World) => createSpecimen(managerCtx(w), (await study(w)).id, { label: `X${++seq}`, condition: "control", stage: null, genotype: null, notes: null });
const upload = async (w: World) => {
  const sp = await specimen(w);
  const { storeUpload } = await import("@/lib/server/data/uploads");
  const { writeFileSync, mkdtempSync } = await import("node:fs");
  const { tmpdir } = await import("node:os");
  const file = `${mkdtempSync(`${tmpdir()}/mk-`)}/a.png`;
  writeFileSync(file, png);
  return storeUpload(managerCtx(w), sp.id, { path: file, filename: "a.png", sizeBytes: png.length, sha256: sha256Hex(Buffer.from(png)), kind: "image", contentType: "image/png", pixelSizeUm: 1, pixelSizeSource: "uploader" });
};
const invitation = async (w: World) => {
  const m = await database();
  const token = newSecret("inv");
  const inv = await m.Invitation.create({ labId: w.labId, email: `inv${++seq}@lab.test`, role: "scientist", tokenHash: sha256Hex(token), invitedBy: w.people.manager.userId, expiresAt: new Date(Date.now() + 86_400_000) });
  return { inv, token };
};
const lab = (w: World, extra: Record<string, string> = {}) => ({ labId: w.labId, ...extra });

const CASES: Record<string, Case> = {
  "POST /api/v1/signup": { setup: async () => ({ json: { name: "N", email: `new${++seq}@lab.test`, password: "long-enough-pw", labName: "New Lab" } }), expect: PUBLIC(201) },
  "GET /api/v1/me": { setup: async () => ({}), expect: USER(200) },
  "PATCH /api/v1/me": { setup: async () => ({ json: { notifyByEmail: false } }), expect: USER(200) },
  "GET /api/v1/labs": { setup: async () => ({}), expect: USER(200) },
  "POST /api/v1/labs": { setup: async () => ({ json: { name: `Lab ${++seq}` } }), expect: USER(201) },
  "GET /api/v1/tokens": { setup: async () => ({}), expect: USER(200) },
  "POST /api/v1/tokens": { setup: async () => ({ json: { name: "script" } }), expect: USER(201) },
  "DELETE /api/v1/tokens/[tokenId]": {
    // Always the manager's token: only the manager may revoke it; for anyone else it does not exist.
    setup: async (w) => {
      const { createToken } = await import("@/lib/server/data/tokens");
      return { params: { tokenId: (await createToken(w.people.manager.actor, "victim")).id } };
    },
    expect: { manager: 204, scientist: 404, modeller: 404, collaborator: 404, outsider: 404, anonymous: 401 },
  },
  "GET /api/v1/invitations/[token]": { setup: async (w) => ({ params: { token: (await invitation(w)).token } }), expect: PUBLIC(200) },
  "POST /api/v1/invitations/[token]/accept": { setup: async (w) => ({ params: { token: (await invitation(w)).token }, json: { name: "Invitee", password: "long-enough-pw" } }), expect: PUBLIC(200) },
  "GET /api/v1/labs/[labId]": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "GET /api/v1/labs/[labId]/members": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "PATCH /api/v1/labs/[labId]/members/[memberId]": {
    setup: async (w) => {
      const p = await makePerson("scientist", w.labId, "extra");
      const m = await database();
      const ms = await m.Membership.findOne({ where: { labId: w.labId, userId: p.userId } });
      return { params: lab(w, { memberId: ms!.id }), json: { role: "modeller" } };
    },
    expect: MANAGER_ONLY(200),
  },
  "DELETE /api/v1/labs/[labId]/members/[memberId]": {
    setup: async (w) => {
      const p = await makePerson("scientist", w.labId, "extra");
      const m = await database();
      const ms = await m.Membership.findOne({ where: { labId: w.labId, userId: p.userId } });
      return { params: lab(w, { memberId: ms!.id }) };
    },
    expect: MANAGER_ONLY(204),
  },
  "GET /api/v1/labs/[labId]/invitations": { setup: async (w) => ({ params: lab(w) }), expect: MANAGER_ONLY(200) },
  "POST /api/v1/labs/[labId]/invitations": { setup: async (w) => ({ params: lab(w), json: { email: `fresh${++seq}@lab.test`, role: "collaborator" } }), expect: MANAGER_ONLY(201) },
  "DELETE /api/v1/labs/[labId]/invitations/[invitationId]": { setup: async (w) => ({ params: lab(w, { invitationId: (await invitation(w)).inv.id }) }), expect: MANAGER_ONLY(204) },
  "GET /api/v1/labs/[labId]/audit": { setup: async (w) => ({ params: lab(w) }), expect: MANAGER_ONLY(200) },
  "GET /api/v1/labs/[labId]/mailbox": { setup: async (w) => ({ params: lab(w) }), expect: MANAGER_ONLY(200) },
  "GET /api/v1/labs/[labId]/studies": { setup: async (w) => ({ params: lab(w), query: "sort=name&dir=asc" }), expect: ALL(200) },
  "POST /api/v1/labs/[labId]/studies": { setup: async (w) => ({ params: lab(w), json: { name: "Mine", tissue: "skin", organism: "chick" } }), expect: NOT_COLLAB(201) },
  "GET /api/v1/labs/[labId]/studies/[studyId]": { setup: async (w) => ({ params: lab(w, { studyId: (await study(w)).id }) }), expect: ALL(200) },
  "PATCH /api/v1/labs/[labId]/studies/[studyId]": { setup: async (w) => ({ params: lab(w, { studyId: (await study(w)).id }), json: { name: "Renamed" } }), expect: MANAGER_ONLY(200) },
  "DELETE /api/v1/labs/[labId]/studies/[studyId]": { setup: async (w) => ({ params: lab(w, { studyId: (await study(w)).id }) }), expect: MANAGER_ONLY(204) },
  "GET /api/v1/labs/[labId]/studies/[studyId]/specimens": { setup: async (w) => ({ params: lab(w, { studyId: (await study(w)).id }) }), expect: ALL(200) },
  "POST /api/v1/labs/[labId]/studies/[studyId]/specimens": { setup: async (w) => ({ params: lab(w, { studyId: (await study(w)).id }), json: { label: "A1", condition: "control" } }), expect: NOT_COLLAB(201) },
  "GET /api/v1/labs/[labId]/specimens/[specimenId]": { setup: async (w) => ({ params: lab(w, { specimenId: (await specimen(w)).id }) }), expect: ALL(200) },
  "PATCH /api/v1/labs/[labId]/specimens/[specimenId]": { setup: async (w) => ({ params: lab(w, { specimenId: (await specimen(w)).id }), json: { stage: "E12" } }), expect: MANAGER_ONLY(200) },
  "DELETE /api/v1/labs/[labId]/specimens/[specimenId]": { setup: async (w) => ({ params: lab(w, { specimenId: (await specimen(w)).id }) }), expect: MANAGER_ONLY(204) },
  "GET /api/v1/labs/[labId]/specimens/[specimenId]/uploads": { setup: async (w) => ({ params: lab(w, { specimenId: (await specimen(w)).id }) }), expect: ALL(200) },
  "POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads": {
    setup: async (w) => ({ params: lab(w, { specimenId: (await specimen(w)).id }), form: multipart({ name: "p.png", bytes: png }, { pixelSizeUm: "0.65" }) }),
    expect: NOT_COLLAB(201),
  },
  "GET /api/v1/labs/[labId]/uploads/[uploadId]": { setup: async (w) => ({ params: lab(w, { uploadId: (await upload(w)).id }) }), expect: ALL(200) },
  "DELETE /api/v1/labs/[labId]/uploads/[uploadId]": { setup: async (w) => ({ params: lab(w, { uploadId: (await upload(w)).id }) }), expect: MANAGER_ONLY(204) },
  "GET /api/v1/labs/[labId]/uploads/[uploadId]/content": { setup: async (w) => ({ params: lab(w, { uploadId: (await upload(w)).id }) }), expect: ALL(200) },
};

let stack: TestStack;
let world: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;

beforeAll(async () => {
  stack = await startTestStack();
  world = await makeWorld();
  routes = await discoverRoutes();
  png = new Uint8Array(await sharp({ create: { width: 32, height: 32, channels: 3, background: { r: 90, g: 120, b: 100 } } }).png().toBuffer());
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
        const token = who === "anonymous" ? undefined : who === "outsider" ? world.outsider.token : world.people[who].token;
        const res = await call(routes.get(key)!, method, path, { token, params: s.params, json: s.json, body: s.form, query: s.query });
        got[who] = res.status;
        if (process.env.DEBUG_MATRIX && res.status >= 400) console.log(key, who, await res.clone().text());
      }
      expect(got).toEqual(c.expect);
    });
  }
});

describe("ownership", () => {
  it("a bench scientist may edit and delete their own study but not the manager's", async () => {
    const own = await createStudy({ actor: world.people.scientist.actor, labId: world.labId, labName: "Test Lab", role: "scientist" }, { name: "Own", tissue: "skin", organism: "chick", description: null });
    const patch = routes.get("PATCH /api/v1/labs/[labId]/studies/[studyId]")!;
    const del = routes.get("DELETE /api/v1/labs/[labId]/studies/[studyId]")!;
    const t = world.people.scientist.token;
    expect((await call(patch, "PATCH", "/api/v1/labs/[labId]/studies/[studyId]", { token: t, params: { labId: world.labId, studyId: own.id }, json: { name: "Own renamed" } })).status).toBe(200);
    expect((await call(del, "DELETE", "/api/v1/labs/[labId]/studies/[studyId]", { token: t, params: { labId: world.labId, studyId: own.id } })).status).toBe(204);
    const theirs = await study(world);
    const res = await call(patch, "PATCH", "/api/v1/labs/[labId]/studies/[studyId]", { token: t, params: { labId: world.labId, studyId: theirs.id }, json: { name: "x" } });
    expect(res.status).toBe(403);
    expect((await res.json()).error.message).toBe("only its creator or a lab manager may change or delete this");
  });

  it("an id from another lab answers 404 even to that lab's manager when asked under this lab", async () => {
    const get = routes.get("GET /api/v1/labs/[labId]/studies/[studyId]")!;
    const s = await study(world);
    const res = await call(get, "GET", "/api/v1/labs/[labId]/studies/[studyId]", { token: world.outsider.token, params: { labId: world.otherLabId, studyId: s.id } });
    expect(res.status).toBe(404);
  });
});
