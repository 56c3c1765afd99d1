/**
 * Every process that runs jobs (the web server's own worker, each `npm run worker`) keeps a row in
 * `workers` with a heartbeat, so that (1) a job whose worker stopped is recognised and taken up
 * again by a live worker, and (2) /api/health can count the live workers.
 */
import "server-only";
import { randomBytes } from "node:crypto";
import { hostname } from "node:os";
import { Op } from "sequelize";
import { database } from "../services";

/** How often a worker records that it is alive (design choice). */
export const HEARTBEAT_MS = 2000;
/**
 * A worker not seen for this long is taken for stopped (design choice: several missed heartbeats,
 * so a briefly busy or starved process keeps its jobs). On the same machine a worker whose process
 * is gone is known at once (see isGone).
 */
export const WORKER_STALE_AFTER_S = 15;

export type WorkerRole = "web" | "worker";

export function newWorkerId(role: WorkerRole): string {
  return `${role}:${hostname().slice(0, 40)}:${process.pid}:${randomBytes(4).toString("hex")}`;
}

/** Records this worker's heartbeat (creating its row when it has none, e.g. after a long pause). */
export async function beat(id: string, role: WorkerRole, concurrency: number): Promise<void> {
  const m = await database();
  const now = new Date();
  const [n] = await m.Worker.update({ seenAt: now, concurrency }, { where: { id } });
  if (n === 0)
    await m.Worker.create({ id, role, host: hostname(), pid: process.pid, concurrency, startedAt: now, seenAt: now });
}

export async function removeWorker(id: string): Promise<void> {
  const m = await database();
  await m.Worker.destroy({ where: { id } });
}

/** Rows of workers gone for an hour without a running job to take up (design choice: an hour). */
export async function removeLongGoneWorkers(): Promise<void> {
  const m = await database();
  await m.Worker.destroy({ where: { seenAt: { [Op.lt]: new Date(Date.now() - 3_600_000) } } });
}

/** Workers whose heartbeat is recent. */
export async function countLiveWorkers(): Promise<number> {
  const m = await database();
  return m.Worker.count({ where: { seenAt: { [Op.gte]: new Date(Date.now() - WORKER_STALE_AFTER_S * 1000) } } });
}

/** True when a worker of this machine has no process any more (killed, crashed). */
function isGone(host: string, pid: number): boolean {
  if (host !== hostname() || pid === process.pid) return false;
  try {
    process.kill(pid, 0);
    return false;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "ESRCH";
  }
}

/**
 * The stopped workers among these ids, with their role ("web" when the row is gone: a job of an
 * unknown worker counts as interrupted by a server stop). Ids without a row are stopped.
 */
export async function findStoppedWorkers(ids: string[], selfId: string | null): Promise<Map<string, WorkerRole>> {
  const m = await database();
  const rows = await m.Worker.findAll({ where: { id: ids } });
  const staleBefore = Date.now() - WORKER_STALE_AFTER_S * 1000;
  const stopped = new Map<string, WorkerRole>();
  for (const id of ids) {
    if (id === selfId) continue;
    const row = rows.find((r) => r.id === id);
    if (!row) stopped.set(id, "web");
    else if (row.seenAt.getTime() < staleBefore || isGone(row.host, row.pid)) stopped.set(id, row.role);
  }
  return stopped;
}
