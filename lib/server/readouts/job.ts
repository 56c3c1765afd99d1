/**
 * Job kind "readout": reads one upload with the settings stored on its readout row.
 *
 * Images and tables are read in a child process (process.ts), so a large image or a table of a
 * million rows never holds the server's event loop. The stored file reaches the child as a file
 * (stored-file.ts: streamed, hashed on the way), never as one buffer.
 *
 * Nothing half-written: derived objects are put first, then the row becomes "succeeded" with its
 * result in one conditional update; if that update finds no running row (the upload was deleted
 * meanwhile) or fails, the objects are removed again. A failure leaves the row "failed" with the
 * reason and no result, and never touches the upload.
 */
import "server-only";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { readoutDerivedKey } from "@/storage/keys";
import { StorageUnavailableError } from "@/storage/object-store";
import { DERIVED_PRODUCTS, type DerivedProduct } from "@/lib/contracts/readout";
import { AppError } from "../errors";
import { database, services } from "../services";
import { toAppError } from "../core-errors";
import { readImage, readTable } from "./process";
import { fetchStoredFile } from "./stored-file";
import { headlineOf, type ReadoutResult } from "./result";
import type { StoredImageSettings, StoredReadoutSettings, StoredTableSettings } from "./settings";
import { JobCancelledError, type JobCleanup, type JobHandler } from "../jobs/types";

const GONE = "the readout was removed (with its upload) before it finished";

export const runReadoutJob: JobHandler = async (job, ctx) => {
  const m = await database();
  const { store } = services();
  const readoutId = String(job.payload.readoutId ?? "");
  const row = await m.Readout.findOne({ where: { id: readoutId, labId: job.labId } });
  if (!row) throw new AppError("not_found", GONE);
  // Immutable: a finished readout is never read again. A job restarted after a server stop may
  // find it "running" (read it again, overwriting the same derived keys) or "succeeded" (the
  // process died after the row was written, before the job was: the job succeeds with it).
  if (row.status === "succeeded")
    return { readoutId: row.id, wavelengthUm: row.wavelengthUm, periodFound: row.periodFound };
  if (row.status !== "queued" && row.status !== "running")
    throw new AppError("conflict", `this readout has already ${row.status}; start a new one instead`);
  const check = () => {
    if (ctx.signal.aborted) throw new JobCancelledError();
  };
  const written: string[] = [];
  // The original is streamed to a file here (never held whole: a slide scan may be 1.8 GB) and
  // read by the child from there; the folder goes with the job, whatever its end.
  const dir = mkdtempSync(path.join(tmpdir(), "morphokin-readout-"));
  try {
    await row.update({ status: "running" });
    const upload = await m.Upload.findByPk(row.uploadId);
    if (!upload) throw new AppError("not_found", GONE);
    const input = await fetchStoredFile(
      store,
      upload.storageKey,
      dir,
      { sha256: row.inputSha256, sizeBytes: upload.sizeBytes },
      ctx.signal,
    );
    await ctx.progress(0.1, "file read");
    check();
    const settings = row.settings as unknown as StoredReadoutSettings;
    let result: ReadoutResult;
    const derivedKeys: Record<string, string> = {};
    if (settings.kind === "image") {
      const out = await readImage(input, settings as StoredImageSettings, ctx.signal, async (f, note) => {
        check();
        await ctx.progress(f, note);
      });
      check();
      for (const [name, body] of Object.entries(out.derived) as Array<[DerivedProduct, Buffer]>) {
        const key = readoutDerivedKey(row.labId, row.uploadId, row.id, name);
        written.push(key);
        await store.put(key, body, { contentType: DERIVED_PRODUCTS[name], contentLength: body.length });
        derivedKeys[name] = key;
      }
      result = out.result;
    } else {
      result = await readTable(input, settings as StoredTableSettings, ctx.signal);
    }
    await ctx.progress(0.95, "saving");
    const h = headlineOf(result);
    const [updated] = await m.Readout.update(
      {
        status: "succeeded",
        result: result as unknown as Record<string, unknown>,
        wavelengthUm: h.wavelengthUm,
        uncertaintyUm: h.uncertaintyUm,
        periodFound: h.periodFound,
        headline: h as unknown as Record<string, unknown>,
        derivedKeys,
        error: null,
      },
      { where: { id: row.id, status: "running" } },
    );
    if (updated === 0) throw new AppError("not_found", GONE);
    written.length = 0;
    return { readoutId: row.id, wavelengthUm: h.wavelengthUm, periodFound: h.periodFound };
  } catch (err) {
    for (const key of written)
      await store.delete(key).catch((e) => console.error(`could not remove derived object ${key}`, e));
    const cancelled = err instanceof JobCancelledError || ctx.signal.aborted;
    const app =
      err instanceof StorageUnavailableError
        ? new AppError("unavailable", "object storage was unreachable during the readout; start it again later")
        : toAppError(err);
    const message = cancelled
      ? "the readout was cancelled"
      : app
        ? app.message
        : "the readout failed on the server; the error was logged";
    await m.Readout.update(
      { status: cancelled ? "cancelled" : "failed", error: message, result: null, derivedKeys: null },
      { where: { id: row.id } },
    ).catch(() => undefined);
    if (cancelled) throw new JobCancelledError();
    throw app ?? err;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
};

/** A killed attempt may have put derived objects; their keys are fixed by the readout's ids. */
export const cleanUpReadoutJob: JobCleanup = async (job) => {
  const m = await database();
  const row = await m.Readout.findOne({ where: { id: String(job.payload.readoutId ?? ""), labId: job.labId } });
  if (!row || row.status === "succeeded") return;
  for (const name of Object.keys(DERIVED_PRODUCTS))
    await services().store.delete(readoutDerivedKey(row.labId, row.uploadId, row.id, name));
};
