/**
 * The upload sweep: what an upload cut short left behind is removed, so that no object survives
 * without its row and no row without its object.
 * - rows still "receiving" after the grace period (the process stopped between writing the row
 *   and finishing): their object, if any, then the row;
 * - objects under `labs/<lab>/uploads/<upload>/` older than the grace period whose upload has no
 *   row (a delete whose storage step failed, or a put that finished after its row was swept);
 * - temporary upload folders of processes that no longer run (any age), or older than a day.
 * `recoverUploadsAtStart()` runs it once at start and then hourly; the server's start-up hook
 * calls it (see the report of the change that added this file).
 */
import "server-only";
import { readdirSync, rmSync, statSync } from "node:fs";
import path from "node:path";
import { Op } from "sequelize";
import { uploadIdOfKey } from "@/storage/keys";
import { activeUploadTemps, uploadTempRoot } from "./multipart";
import { database, services } from "../services";

export interface SweepReport {
  rowsRemoved: number;
  objectsRemoved: number;
  tempFoldersRemoved: number;
}

/** A temporary folder of a running process is left alone for this long at most (ms). */
const TEMP_FOLDER_MAX_AGE_MS = 24 * 3600 * 1000;
const SWEEP_EVERY_MS = 3600 * 1000;

function processRuns(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "EPERM";
  }
}

function sweepTempFolders(root: string, now: number): number {
  let removed = 0;
  let names: string[];
  try {
    names = readdirSync(root);
  } catch {
    return 0; // no folder yet: nothing was ever received
  }
  const active = activeUploadTemps();
  for (const name of names) {
    const dir = path.join(root, name);
    if (active.has(dir)) continue;
    const pid = Number(name.split("-")[0]);
    const ownerGone = !Number.isInteger(pid) || pid === process.pid || !processRuns(pid);
    let ageMs = 0;
    try {
      ageMs = now - statSync(dir).mtimeMs;
    } catch {
      continue; // removed meanwhile
    }
    if (ownerGone || ageMs > TEMP_FOLDER_MAX_AGE_MS) {
      rmSync(dir, { recursive: true, force: true });
      removed++;
    }
  }
  return removed;
}

/** One pass of the sweep. `graceMs` 0 treats every unfinished upload as abandoned (tests, tools). */
export async function sweepUploads(options: { graceMs?: number } = {}): Promise<SweepReport> {
  const { config, store } = services();
  const m = await database();
  const now = Date.now();
  const cutoff = new Date(now - (options.graceMs ?? config.uploadGraceS * 1000));
  const report: SweepReport = { rowsRemoved: 0, objectsRemoved: 0, tempFoldersRemoved: 0 };

  const stale = await m.Upload.unscoped().findAll({
    where: { state: "receiving", createdAt: { [Op.lte]: cutoff } },
    attributes: ["id", "storageKey"],
  });
  for (const row of stale) {
    await store.delete(row.storageKey); // deleting a missing key is no error in S3
    report.rowsRemoved += await m.Upload.unscoped().destroy({ where: { id: row.id, state: "receiving" } });
  }

  const old = (await store.list("labs/")).filter((o) => o.lastModified <= cutoff && uploadIdOfKey(o.key));
  const ids = [...new Set(old.map((o) => uploadIdOfKey(o.key)!.uploadId))];
  const known = new Set<string>();
  for (let i = 0; i < ids.length; i += 500) {
    const rows = await m.Upload.unscoped().findAll({ where: { id: ids.slice(i, i + 500) }, attributes: ["id"] });
    for (const r of rows) known.add(r.id);
  }
  for (const o of old) {
    if (known.has(uploadIdOfKey(o.key)!.uploadId)) continue;
    await store.delete(o.key);
    report.objectsRemoved++;
  }

  report.tempFoldersRemoved = sweepTempFolders(uploadTempRoot(config.dataDir), now);
  return report;
}

const g = globalThis as unknown as {
  __morphokinUploadSweep?: { timer: NodeJS.Timeout; first: Promise<SweepReport | null> };
};

async function sweepAndLog(): Promise<SweepReport | null> {
  try {
    const r = await sweepUploads();
    if (r.rowsRemoved || r.objectsRemoved || r.tempFoldersRemoved) {
      console.log(
        `upload sweep: removed ${r.rowsRemoved} unfinished upload(s), ${r.objectsRemoved} object(s) without a row, ${r.tempFoldersRemoved} temporary folder(s)`,
      );
    }
    return r;
  } catch (err) {
    console.error("upload sweep failed; it runs again in an hour", err);
    return null;
  }
}

/**
 * Sweeps once now and then every hour (the timer does not keep the process alive). Safe to call
 * more than once: later calls return the first sweep. Call it from the server's start-up hook.
 */
export function recoverUploadsAtStart(): Promise<SweepReport | null> {
  if (!g.__morphokinUploadSweep) {
    const timer = setInterval(() => void sweepAndLog(), SWEEP_EVERY_MS);
    timer.unref();
    g.__morphokinUploadSweep = { timer, first: sweepAndLog() };
  }
  return g.__morphokinUploadSweep.first;
}

/** Stops the hourly sweep (tests). */
export function stopUploadSweep(): void {
  if (g.__morphokinUploadSweep) clearInterval(g.__morphokinUploadSweep.timer);
  g.__morphokinUploadSweep = undefined;
}
