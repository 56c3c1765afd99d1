/**
 * Large files need room on the server's disk, not in its memory: an upload that does not fit on
 * the disk is refused before a byte is written, with the sizes in the user's words; a readout
 * streams the stored original to a file (SHA-256 checked on the way) and refuses, the same way,
 * when the disk cannot hold it. The free space is faked (statfsSync) to stand for a full disk.
 * Expected statuses and messages are the product's own rules (common practice, no source).
 */
import { createHash } from "node:crypto";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it, vi } from "vitest";

/** Free bytes the faked disk reports (null: the real figure). */
let fakeFreeBytes: number | null = null;
vi.mock("node:fs", async (importOriginal) => {
  const fs = await importOriginal<typeof import("node:fs")>();
  const statfsSync = ((p: string) => {
    const real = fs.statfsSync(p);
    return fakeFreeBytes === null ? real : { ...real, bsize: 1, bavail: fakeFreeBytes };
  }) as typeof fs.statfsSync;
  return { ...fs, default: { ...fs, statfsSync }, statfsSync };
});

const { createSpecimen } = await import("@/lib/server/studies/specimens");
const { createStudy } = await import("@/lib/server/studies/studies");
const { database, services } = await import("@/lib/server/services");
const { fetchStoredFile } = await import("@/lib/server/readouts/stored-file");
const { call, multipart } = await import("../support/api");
const { setupLabApi } = await import("../support/lab-api");

let specimenId: string;
const lab = setupLabApi({
  setup: async (l) => {
    const ctx = l.ctx("scientist");
    const s = await createStudy(ctx, { name: "S", tissue: "skin", organism: "chick", description: null });
    specimenId = (
      await createSpecimen(ctx, s.id, { label: "A", condition: "control", stage: null, genotype: null, notes: null })
    ).id;
  },
});
const dir = mkdtempSync(path.join(tmpdir(), "morphokin-room-"));
afterAll(() => {
  fakeFreeBytes = null;
  rmSync(dir, { recursive: true, force: true });
});

const UPLOADS = "POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads";
const MIB = 2 ** 20;

describe("room on the server's disk for large files", () => {
  it("an upload larger than the free disk space is refused first (413), naming the sizes; nothing is written", async () => {
    const m = await database();
    const before = await m.Upload.count();
    const form = multipart({ name: "scan.tif", bytes: new Uint8Array(4096) }, { pixelSizeUm: "0.5" });
    const sent = new Response(form);
    const body = new Uint8Array(await sent.arrayBuffer());
    fakeFreeBytes = 100 * MIB; // less than the file plus the 256 MiB kept to work in
    try {
      const res = await call(lab.route(UPLOADS), "POST", "/api/v1/labs/[labId]/specimens/[specimenId]/uploads", {
        token: lab.w.people.scientist.token,
        params: { labId: lab.w.labId, specimenId },
        headers: { "content-type": sent.headers.get("content-type")!, "content-length": String(body.length) },
        body,
      });
      expect(res.status).toBe(413);
      const { error } = (await res.json()) as { error: { message: string } };
      expect(error.message).toMatch(/this upload \(1 MiB\) needs 256 MiB of free disk space on the server/);
      expect(error.message).toMatch(/only 100 MiB is free now; try again later/);
    } finally {
      fakeFreeBytes = null;
    }
    expect(await m.Upload.count()).toBe(before);
  });

  it("a readout streams the stored original to a file and checks its SHA-256 on the way", async () => {
    const { store } = services();
    const bytes = new Uint8Array(3 * MIB + 17).map((_, i) => (i * 31) % 251);
    const sha256 = createHash("sha256").update(bytes).digest("hex");
    await store.put("tests/room/original", Buffer.from(bytes), {
      contentType: "image/tiff",
      contentLength: bytes.length,
    });
    const signal = new AbortController().signal;
    const ok = mkdtempSync(path.join(dir, "ok-"));
    const file = await fetchStoredFile(store, "tests/room/original", ok, { sha256, sizeBytes: bytes.length }, signal);
    expect(Buffer.compare(readFileSync(file), Buffer.from(bytes))).toBe(0);

    const changed = mkdtempSync(path.join(dir, "changed-"));
    await expect(
      fetchStoredFile(
        store,
        "tests/room/original",
        changed,
        { sha256: "0".repeat(64), sizeBytes: bytes.length },
        signal,
      ),
    ).rejects.toThrow(/the stored file's SHA-256 \(.{12}…\) differs from the one recorded at upload/);

    const full = mkdtempSync(path.join(dir, "full-"));
    fakeFreeBytes = 200 * MIB;
    try {
      await expect(
        fetchStoredFile(store, "tests/room/original", full, { sha256, sizeBytes: 2 * 2 ** 30 }, signal),
      ).rejects.toThrow(
        /reading this upload needs 2\.3 GiB of free disk space on the server \(the file is 2\.0 GiB, plus 256 MiB to work in\), but only 200 MiB is free now; ask the lab's server administrator to free disk space/,
      );
    } finally {
      fakeFreeBytes = null;
    }
    expect(existsSync(path.join(full, "input"))).toBe(false);
    await store.delete("tests/room/original");
  });
});
