/**
 * Bad input and failures (uploads and lists): each gets a clear message and the right status, and nothing is
 * half-written (no row without its object, no object without its row).
 * Expected statuses and messages are the product's own rules (common practice, no source).
 */
import { createHash } from "node:crypto";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { createS3ObjectStore } from "@/storage/s3-object-store";
import { database, setServicesForTest } from "@/lib/server/services";
import { call, multipart } from "../support/api";
import { DEAD_PORT } from "../support/stack";
import { setupLabApi } from "../support/lab-api";

let specimenId: string;
let png: Uint8Array;

const lab = setupLabApi({
  setup: async (l) => {
    const ctx = l.ctx("scientist");
    const s = await createStudy(ctx, { name: "S", tissue: "skin", organism: "chick", description: null });
    specimenId = (
      await createSpecimen(ctx, s.id, { label: "A", condition: "control", stage: null, genotype: null, notes: null })
    ).id;
    png = new Uint8Array(
      await sharp({ create: { width: 16, height: 16, channels: 3, background: "#336655" } })
        .png()
        .toBuffer(),
    );
  },
});
const R = (k: string) => lab.route(k);
const errorOf = async (res: Response) => ((await res.json()) as { error: { code: string; message: string } }).error;
const UPLOADS = "POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads";
const upload = (form: FormData, token = lab.w.people.scientist.token) =>
  call(R(UPLOADS), "POST", "/api/v1/labs/[labId]/specimens/[specimenId]/uploads", {
    token,
    params: { labId: lab.w.labId, specimenId },
    body: form,
  });
const counts = async () => {
  const m = await database();
  return {
    rows: await m.Upload.count(),
    objects: (await import("node:fs"))
      .readdirSync(`${lab.stack.dir}/s3`, { recursive: true })
      .filter((f) => String(f).endsWith("original._S3rver_object")).length,
  };
};

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
      { token: lab.w.people.collaborator.token, params: { labId: lab.w.labId, uploadId: u.id } },
    );
    expect(Buffer.from(await dl.arrayBuffer()).equals(Buffer.from(png))).toBe(true);
    const del = await call(
      R("DELETE /api/v1/labs/[labId]/uploads/[uploadId]"),
      "DELETE",
      "/api/v1/labs/[labId]/uploads/[uploadId]",
      { token: lab.w.people.scientist.token, params: { labId: lab.w.labId, uploadId: u.id } },
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
      /^Pixel size \(µm per pixel\): “tile\.png” carries no pixel size in its metadata.*; enter the pixel size in µm\/px$/,
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
    const big = new Uint8Array(lab.stack.services.config.maxUploadBytes + 10);
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
      "“looks-like.png” is not a PNG, JPEG or TIFF image nor a CSV/TSV or XLSX table (judged by its content, not its name)",
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
    expect((await errorOf(res)).message).toBe("Pixel size (µm per pixel) must be above 0 µm/px");
  });

  it("with storage unreachable the upload is a 503 and leaves no row behind", async () => {
    const before = await counts();
    const dead = createS3ObjectStore({ ...lab.stack.services.config.s3, endpoint: `http://127.0.0.1:${DEAD_PORT}` });
    setServicesForTest({ ...lab.stack.services, store: dead });
    try {
      const res = await upload(multipart({ name: "tile.png", bytes: png }, { pixelSizeUm: "1" }));
      expect(res.status).toBe(503);
      expect((await errorOf(res)).message).toBe(
        "object storage is unreachable, so the file was not saved; try again later",
      );
      expect(await counts()).toEqual(before);
    } finally {
      setServicesForTest(lab.stack.services);
    }
  });

  it("with storage unreachable a delete is a 503 and keeps the row", async () => {
    const res = await upload(multipart({ name: "keep.png", bytes: png }, { pixelSizeUm: "1" }));
    const u = (await res.json()) as { id: string };
    const before = await counts();
    const dead = createS3ObjectStore({ ...lab.stack.services.config.s3, endpoint: `http://127.0.0.1:${DEAD_PORT}` });
    setServicesForTest({ ...lab.stack.services, store: dead });
    try {
      const del = await call(
        R("DELETE /api/v1/labs/[labId]/uploads/[uploadId]"),
        "DELETE",
        "/api/v1/labs/[labId]/uploads/[uploadId]",
        { token: lab.w.people.scientist.token, params: { labId: lab.w.labId, uploadId: u.id } },
      );
      expect(del.status).toBe(503);
      expect(await counts()).toEqual(before);
    } finally {
      setServicesForTest(lab.stack.services);
    }
  });

  it("a specimen with files cannot be deleted until they are", async () => {
    const res = await call(
      R("DELETE /api/v1/labs/[labId]/specimens/[specimenId]"),
      "DELETE",
      "/api/v1/labs/[labId]/specimens/[specimenId]",
      { token: lab.w.people.scientist.token, params: { labId: lab.w.labId, specimenId } },
    );
    expect(res.status).toBe(409);
    expect((await errorOf(res)).message).toMatch(/^this specimen still has \d+ uploaded file\(s\); delete them first$/);
  });
});

describe("lists", () => {
  it("paginate, sort and filter, and reject an unknown sort column", async () => {
    const ctx = {
      actor: lab.w.people.scientist.actor,
      labId: lab.w.labId,
      labName: "Test Lab",
      role: "scientist" as const,
    };
    for (const n of ["Gamma", "Alpha", "Beta"])
      await createStudy(ctx, { name: `List ${n}`, tissue: "fin", organism: "fish", description: null });
    const list = (q: string) =>
      call(R("GET /api/v1/labs/[labId]/studies"), "GET", "/api/v1/labs/[labId]/studies", {
        token: lab.w.people.collaborator.token,
        params: { labId: lab.w.labId },
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
