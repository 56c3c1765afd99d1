/**
 * Bad input and failures: each gets a clear message and the right status, and nothing is
 * half-written (no row without its object, no object without its row).
 * Expected statuses and messages are the product's own rules (common practice, no source).
 */
import { createHash } from "node:crypto";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { createS3ObjectStore } from "@/storage/s3-object-store";
import { authOptions } from "@/lib/server/accounts/auth";
import { database, setServicesForTest } from "@/lib/server/services";
import { newSecret, sha256Hex } from "@/lib/server/secrets";
import { call, discoverRoutes, multipart } from "../support/api";
import { DEAD_PORT, startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
let specimenId: string;
let png: Uint8Array;

const R = (k: string) => routes.get(k)!;
const errorOf = async (res: Response) => ((await res.json()) as { error: { code: string; message: string } }).error;
const UPLOADS = "POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads";
const upload = (form: FormData, token = w.people.scientist.token) =>
  call(R(UPLOADS), "POST", "/api/v1/labs/[labId]/specimens/[specimenId]/uploads", {
    token,
    params: { labId: w.labId, specimenId },
    body: form,
  });
const counts = async () => {
  const m = await database();
  return {
    rows: await m.Upload.count(),
    objects: (await import("node:fs"))
      .readdirSync(`${stack.dir}/s3`, { recursive: true })
      .filter((f) => String(f).endsWith("original._S3rver_object")).length,
  };
};

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
  const ctx = { actor: w.people.scientist.actor, labId: w.labId, labName: "Test Lab", role: "scientist" as const };
  const s = await createStudy(ctx, { name: "S", tissue: "skin", organism: "chick", description: null });
  specimenId = (
    await createSpecimen(ctx, s.id, { label: "A", condition: "control", stage: null, genotype: null, notes: null })
  ).id;
  png = new Uint8Array(
    await sharp({ create: { width: 16, height: 16, channels: 3, background: "#336655" } })
      .png()
      .toBuffer(),
  );
});
afterAll(async () => stack?.close());

describe("accounts", () => {
  it("rejects a wrong password (the credentials provider returns no user)", async () => {
    const provider = authOptions().providers.find((p) => p.id === "credentials") as unknown as {
      options: { authorize: (c: unknown) => Promise<unknown> };
    };
    expect(
      await provider.options.authorize({ email: w.people.manager.email, password: "not-the-password" }),
    ).toBeNull();
    expect(
      await provider.options.authorize({ email: w.people.manager.email, password: "long-enough-pw" }),
    ).toMatchObject({ email: w.people.manager.email });
  });

  // Changed by issue 10, item 9 (no account enumeration): a taken address is no longer a 409 that
  // names it; it answers like a new one, and the mail says the rest (tests/api/auth-signup.test.ts).
  it("a duplicate e-mail at sign-up answers like a new one (202, check your e-mail)", async () => {
    const res = await call(R("POST /api/v1/signup"), "POST", "/api/v1/signup", {
      json: { name: "X", email: w.people.manager.email.toUpperCase(), password: "long-enough-pw", labName: "Dup Lab" },
    });
    expect(res.status).toBe(202);
    expect(await res.json()).toEqual({
      status: "check-email",
      email: w.people.manager.email,
      message: `Check your e-mail: a message to ${w.people.manager.email} tells you how to go on.`,
    });
  });

  it("a short password and a bad e-mail are 400 with both fields named", async () => {
    const res = await call(R("POST /api/v1/signup"), "POST", "/api/v1/signup", {
      json: { name: "X", email: "nope", password: "short", labName: "L" },
    });
    expect(res.status).toBe(400);
    const e = await errorOf(res);
    expect(e.message).toContain("email: enter a valid e-mail address");
    expect(e.message).toContain("password: at least 10 characters");
    expect(e.message).toContain("labName: at least 2 characters");
  });

  it("malformed JSON is a 400 that says so", async () => {
    const res = await call(R("POST /api/v1/labs/[labId]/studies"), "POST", "/api/v1/labs/[labId]/studies", {
      token: w.people.scientist.token,
      params: { labId: w.labId },
      body: "{not json",
      headers: { "content-type": "application/json" },
    });
    expect(res.status).toBe(400);
    expect((await errorOf(res)).message).toBe("the request body is not valid JSON");
  });

  it("an unknown or revoked API token is a 401", async () => {
    const res = await call(R("GET /api/v1/me"), "GET", "/api/v1/me", { token: "mk_unknown" });
    expect(res.status).toBe(401);
    expect((await errorOf(res)).message).toBe("that API token is unknown or revoked");
  });
});

describe("invitations", () => {
  const make = async (o: { expired?: boolean } = {}) => {
    const m = await database();
    const token = newSecret("inv");
    await m.Invitation.create({
      labId: w.labId,
      email: `i${Math.random().toString(36).slice(2)}@lab.test`,
      role: "modeller",
      tokenHash: sha256Hex(token),
      invitedBy: w.people.manager.userId,
      expiresAt: new Date(Date.now() + (o.expired ? -1000 : 86_400_000)),
    });
    return token;
  };
  const accept = (token: string) =>
    call(R("POST /api/v1/invitations/[token]/accept"), "POST", "/api/v1/invitations/[token]/accept", {
      params: { token },
      json: { name: "New Person", password: "long-enough-pw" },
    });

  it("works once; a reused link is a 409 that says it was used", async () => {
    const token = await make();
    expect((await accept(token)).status).toBe(200);
    const again = await accept(token);
    expect(again.status).toBe(409);
    expect((await errorOf(again)).message).toBe("this invitation was already used; sign in instead");
  });

  it("an expired link is a 409 that says it expired, and creates no user", async () => {
    const m = await database();
    const before = await m.User.count();
    const res = await accept(await make({ expired: true }));
    expect(res.status).toBe(409);
    expect((await errorOf(res)).message).toBe("this invitation has expired; ask the lab manager for a new one");
    expect(await m.User.count()).toBe(before);
  });

  it("a made-up token is a 404", async () => {
    expect((await accept("inv_madeup")).status).toBe(404);
  });

  it("inviting an existing member is a 409", async () => {
    const res = await call(R("POST /api/v1/labs/[labId]/invitations"), "POST", "/api/v1/labs/[labId]/invitations", {
      token: w.people.manager.token,
      params: { labId: w.labId },
      json: { email: w.people.scientist.email, role: "modeller" },
    });
    expect(res.status).toBe(409);
    expect((await errorOf(res)).message).toBe(`${w.people.scientist.email} is already a member of this lab`);
  });

  it("the invitation e-mail arrives in the fake mailbox with a working link", async () => {
    const email = `mailed${Date.now()}@lab.test`;
    const res = await call(R("POST /api/v1/labs/[labId]/invitations"), "POST", "/api/v1/labs/[labId]/invitations", {
      token: w.people.manager.token,
      params: { labId: w.labId },
      json: { email, role: "collaborator" },
    });
    expect(res.status).toBe(201);
    const mail = (await (await fetch(`${stack.mailboxUrl}/messages?to=${email}`)).json()) as {
      messages: { text: string }[];
    };
    expect(mail.messages).toHaveLength(1);
    const token = /\/invite\/(\S+)/.exec(mail.messages[0].text)![1];
    expect((await accept(token)).status).toBe(200);
  });

  it("a lab's development mailbox shows its invitees' mail and not another lab's", async () => {
    const ours = `ours${Date.now()}@lab.test`,
      theirs = `theirs${Date.now()}@lab.test`;
    const invite = (labId: string, token: string, email: string) =>
      call(R("POST /api/v1/labs/[labId]/invitations"), "POST", "/api/v1/labs/[labId]/invitations", {
        token,
        params: { labId },
        json: { email, role: "collaborator" },
      });
    expect((await invite(w.labId, w.people.manager.token, ours)).status).toBe(201);
    expect((await invite(w.otherLabId, w.outsider.token, theirs)).status).toBe(201);
    const box = async (labId: string, token: string) => {
      const res = await call(R("GET /api/v1/labs/[labId]/mailbox"), "GET", "/api/v1/labs/[labId]/mailbox", {
        token,
        params: { labId },
      });
      return ((await res.json()) as { items: { to: string[] }[] }).items.flatMap((x) => x.to);
    };
    const mine = await box(w.labId, w.people.manager.token),
      other = await box(w.otherLabId, w.outsider.token);
    expect(mine).toContain(ours);
    expect(mine).not.toContain(theirs);
    expect(other).toContain(theirs);
    expect(other).not.toContain(ours);
  });
});

describe("members", () => {
  it("the last lab manager can neither be demoted nor removed", async () => {
    const m = await database();
    const me = await m.Membership.findOne({ where: { labId: w.labId, userId: w.people.manager.userId } });
    const patch = await call(
      R("PATCH /api/v1/labs/[labId]/members/[memberId]"),
      "PATCH",
      "/api/v1/labs/[labId]/members/[memberId]",
      { token: w.people.manager.token, params: { labId: w.labId, memberId: me!.id }, json: { role: "scientist" } },
    );
    expect(patch.status).toBe(409);
    expect((await errorOf(patch)).message).toBe(
      "a lab must keep at least one lab manager: make someone else lab manager first",
    );
    const del = await call(
      R("DELETE /api/v1/labs/[labId]/members/[memberId]"),
      "DELETE",
      "/api/v1/labs/[labId]/members/[memberId]",
      { token: w.people.manager.token, params: { labId: w.labId, memberId: me!.id } },
    );
    expect(del.status).toBe(409);
    expect((await m.Membership.findByPk(me!.id))!.role).toBe("manager");
  });

  it("a role change is in the audit trail with who, what and when", async () => {
    const m = await database();
    const ms = await m.Membership.findOne({ where: { labId: w.labId, userId: w.people.modeller.userId } });
    await call(R("PATCH /api/v1/labs/[labId]/members/[memberId]"), "PATCH", "/api/v1/labs/[labId]/members/[memberId]", {
      token: w.people.manager.token,
      params: { labId: w.labId, memberId: ms!.id },
      json: { role: "collaborator" },
    });
    const res = await call(R("GET /api/v1/labs/[labId]/audit"), "GET", "/api/v1/labs/[labId]/audit", {
      token: w.people.manager.token,
      params: { labId: w.labId },
      query: "q=role_changed",
    });
    const body = (await res.json()) as { items: { actorEmail: string; summary: string; at: string }[] };
    expect(body.items[0].actorEmail).toBe(w.people.manager.email);
    expect(body.items[0].summary).toBe(
      `${w.people.manager.email} changed ${w.people.modeller.email} from Modeller to Collaborator`,
    );
    expect(Date.now() - Date.parse(body.items[0].at)).toBeLessThan(60_000);
  });
});

describe("uploads", () => {
  it("stores original + row with the right SHA-256, downloads the same bytes, deletes both", async () => {
    const before = await counts();
    const res = await upload(multipart({ name: "tile.png", bytes: png }, { pixelSizeUm: "0.5" }));
    expect(res.status).toBe(201);
    const u = (await res.json()) as {
      id: string;
      sha256: string;
      kind: string;
      contentType: string;
      pixelSizeUm: number;
    };
    // SHA-256 by node:crypto (a reference implementation of FIPS 180-4).
    expect(u.sha256).toBe(createHash("sha256").update(png).digest("hex"));
    expect(u).toMatchObject({ kind: "image", contentType: "image/png", pixelSizeUm: 0.5 });
    expect(await counts()).toEqual({ rows: before.rows + 1, objects: before.objects + 1 });
    const dl = await call(
      R("GET /api/v1/labs/[labId]/uploads/[uploadId]/content"),
      "GET",
      "/api/v1/labs/[labId]/uploads/[uploadId]/content",
      { token: w.people.collaborator.token, params: { labId: w.labId, uploadId: u.id } },
    );
    expect(Buffer.from(await dl.arrayBuffer()).equals(Buffer.from(png))).toBe(true);
    const del = await call(
      R("DELETE /api/v1/labs/[labId]/uploads/[uploadId]"),
      "DELETE",
      "/api/v1/labs/[labId]/uploads/[uploadId]",
      { token: w.people.scientist.token, params: { labId: w.labId, uploadId: u.id } },
    );
    expect(del.status).toBe(204);
    expect(await counts()).toEqual(before);
  });

  it("a TIFF's own resolution tags give the pixel size when none is typed", async () => {
    const { encodeTiff16 } = await import("@/lib/imaging");
    const { makeStripes } = await import("@/lib/synthetic");
    const tif = await encodeTiff16(makeStripes({ width: 32, height: 32, wavelengthPx: 8, angleDeg: 0 }), {
      pixelSizeUm: 0.325,
    });
    const res = await upload(multipart({ name: "s.tif", bytes: new Uint8Array(tif) }));
    expect(res.status).toBe(201);
    const u = (await res.json()) as { pixelSizeUm: number; pixelSizeSource: string; contentType: string };
    expect(u.contentType).toBe("image/tiff");
    expect(u.pixelSizeSource).toBe("tiff-resolution");
    expect(u.pixelSizeUm).toBeCloseTo(0.325, 4);
  });

  it("an image without pixel size in file or form is a 400 naming the field", async () => {
    const res = await upload(multipart({ name: "tile.png", bytes: png }));
    expect(res.status).toBe(400);
    expect((await errorOf(res)).message).toMatch(
      /^pixelSizeUm: “tile\.png” carries no pixel size in its metadata.*; enter the pixel size in µm\/px$/,
    );
  });

  it("an empty file is a 400", async () => {
    const before = await counts();
    const res = await upload(multipart({ name: "empty.csv", bytes: new Uint8Array(0) }));
    expect(res.status).toBe(400);
    expect((await errorOf(res)).message).toBe("the file is empty (0 bytes)");
    expect(await counts()).toEqual(before);
  });

  it("a file over the limit is a 413 that states the limit", async () => {
    const before = await counts();
    const big = new Uint8Array(stack.services.config.maxUploadBytes + 10);
    big.set(png.subarray(0, 8));
    const res = await upload(multipart({ name: "big.png", bytes: big }, { pixelSizeUm: "1" }));
    expect(res.status).toBe(413);
    expect((await errorOf(res)).message).toBe("the file is too large: the limit is 2097152 bytes (2 MiB)");
    expect(await counts()).toEqual(before);
  });

  it("the type is judged by content: junk named .png is a 400", async () => {
    const junk = new Uint8Array(256).map((_, i) => (i * 37 + 11) % 256);
    const res = await upload(multipart({ name: "looks-like.png", bytes: junk }, { pixelSizeUm: "1" }));
    expect(res.status).toBe(400);
    expect((await errorOf(res)).message).toBe(
      "“looks-like.png” is not a PNG, JPEG or TIFF image nor a CSV/TSV table (judged by its content, not its name)",
    );
  });

  it("a CSV named .png is stored as a table", async () => {
    const res = await upload(
      multipart({ name: "really-a-table.png", bytes: new TextEncoder().encode("x,y\n1,2\n3,4\n") }),
    );
    expect(res.status).toBe(201);
    expect(await res.json()).toMatchObject({ kind: "table", contentType: "text/csv" });
  });

  it("a bad pixel size is a 400 naming the field and the limit", async () => {
    const res = await upload(multipart({ name: "tile.png", bytes: png }, { pixelSizeUm: "-2" }));
    expect(res.status).toBe(400);
    expect((await errorOf(res)).message).toBe("pixelSizeUm: pixel size must be above 0 µm/px");
  });

  it("with storage unreachable the upload is a 503 and leaves no row behind", async () => {
    const before = await counts();
    const dead = createS3ObjectStore({ ...stack.services.config.s3, endpoint: `http://127.0.0.1:${DEAD_PORT}` });
    setServicesForTest({ ...stack.services, store: dead });
    try {
      const res = await upload(multipart({ name: "tile.png", bytes: png }, { pixelSizeUm: "1" }));
      expect(res.status).toBe(503);
      expect((await errorOf(res)).message).toBe(
        "object storage is unreachable, so the file was not saved; try again later",
      );
      expect(await counts()).toEqual(before);
    } finally {
      setServicesForTest(stack.services);
    }
  });

  it("with storage unreachable a delete is a 503 and keeps the row", async () => {
    const res = await upload(multipart({ name: "keep.png", bytes: png }, { pixelSizeUm: "1" }));
    const u = (await res.json()) as { id: string };
    const before = await counts();
    const dead = createS3ObjectStore({ ...stack.services.config.s3, endpoint: `http://127.0.0.1:${DEAD_PORT}` });
    setServicesForTest({ ...stack.services, store: dead });
    try {
      const del = await call(
        R("DELETE /api/v1/labs/[labId]/uploads/[uploadId]"),
        "DELETE",
        "/api/v1/labs/[labId]/uploads/[uploadId]",
        { token: w.people.scientist.token, params: { labId: w.labId, uploadId: u.id } },
      );
      expect(del.status).toBe(503);
      expect(await counts()).toEqual(before);
    } finally {
      setServicesForTest(stack.services);
    }
  });

  it("a specimen with files cannot be deleted until they are", async () => {
    const res = await call(
      R("DELETE /api/v1/labs/[labId]/specimens/[specimenId]"),
      "DELETE",
      "/api/v1/labs/[labId]/specimens/[specimenId]",
      { token: w.people.scientist.token, params: { labId: w.labId, specimenId } },
    );
    expect(res.status).toBe(409);
    expect((await errorOf(res)).message).toMatch(/^this specimen still has \d+ uploaded file\(s\); delete them first$/);
  });
});

describe("lists", () => {
  it("paginate, sort and filter, and reject an unknown sort column", async () => {
    const ctx = { actor: w.people.scientist.actor, labId: w.labId, labName: "Test Lab", role: "scientist" as const };
    for (const n of ["Gamma", "Alpha", "Beta"])
      await createStudy(ctx, { name: `List ${n}`, tissue: "fin", organism: "fish", description: null });
    const list = (q: string) =>
      call(R("GET /api/v1/labs/[labId]/studies"), "GET", "/api/v1/labs/[labId]/studies", {
        token: w.people.collaborator.token,
        params: { labId: w.labId },
        query: q,
      });
    const page = (await (await list("q=List&sort=name&dir=asc&pageSize=2&page=1")).json()) as {
      items: { name: string }[];
      total: number;
    };
    expect(page.total).toBe(3);
    expect(page.items.map((s) => s.name)).toEqual(["List Alpha", "List Beta"]);
    const p2 = (await (await list("q=List&sort=name&dir=asc&pageSize=2&page=2")).json()) as {
      items: { name: string }[];
    };
    expect(p2.items.map((s) => s.name)).toEqual(["List Gamma"]);
    const bad = await list("sort=password");
    expect(bad.status).toBe(400);
    expect((await errorOf(bad)).message).toMatch(/^sort: /);
  });
});
