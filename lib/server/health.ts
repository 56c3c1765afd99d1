/**
 * Health of each part: database (with its dialect: "sqlite" or "postgres"), object storage, mail,
 * and the jobs: the queue ("in-process" or "pg-boss") and how many workers sent a heartbeat lately.
 */
import "server-only";
import { countLiveWorkers } from "./jobs/worker-registry";
import { services } from "./services";

export type PartStatus = { ok: true } | { ok: false; error: string };

async function probe(fn: () => Promise<unknown>, ms = 3000): Promise<PartStatus> {
  try {
    await Promise.race([
      fn(),
      new Promise((_, reject) => setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms)),
    ]);
    return { ok: true };
  } catch (err) {
    return { ok: false, error: err instanceof Error ? err.message : String(err) };
  }
}

export async function checkHealth() {
  const s = services();
  const [database, storage, mail] = await Promise.all([
    probe(async () => {
      await s.db.ready;
      await s.db.sequelize.query("SELECT 1");
    }),
    probe(() => s.store.check()),
    probe(() => s.mailer.check()),
  ]);
  const dialect = s.db.sequelize.getDialect();
  const liveWorkers = database.ok ? await countLiveWorkers().catch(() => null) : null;
  return {
    ok: database.ok && storage.ok && mail.ok,
    database: { ...database, dialect },
    storage,
    mail,
    jobs: { queue: s.jobs.name, liveWorkers },
  };
}
