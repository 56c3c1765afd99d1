/**
 * One Sequelize instance per process, with its models and migrations applied: PostgreSQL (through
 * `pg`) when the location is a `postgres://` URL (DATABASE_URL), else a SQLite file (sqlite3).
 * The same models and migrations serve both.
 *
 * SQLite only: WAL mode and foreign keys are set on the connection; every connection waits up to
 * BUSY_TIMEOUT_MS for another's write lock (Sequelize opens one sqlite3 connection per
 * transaction, and a PRAGMA on the default connection would not reach those).
 *
 * SQLite only: writes of this process take turns in a JS write queue (write-queue.ts) in front of
 * SQLite: every transaction, and every write outside one, waits there (bounded: 503 with
 * Retry-After) instead of in sqlite3's busy handler on a libuv thread. Reads never queue (WAL lets
 * them run beside the one writer). The busy timeout stays for other processes (CLI, migrations).
 * PostgreSQL has row locks and many concurrent writers, so it gets no queue.
 */
import "server-only";
import { mkdirSync } from "node:fs";
import path from "node:path";
import { QueryTypes, Sequelize, Transaction } from "sequelize";
import pg from "pg";
import sqlite3 from "sqlite3";
import { AsyncLocalStorage } from "node:async_hooks";
import { createModels, type Models } from "@/models";
import {
  CHANGE_COUNTS,
  countedTables,
  SCHEMA_OBJECTS_SQL,
  tableNamer,
  tablesOf,
  type SchemaObject,
} from "./change-counts";
import { migrateUp } from "./migrate";
import { createWriteQueue, type WriteQueue } from "./write-queue";

export interface Database {
  sequelize: Sequelize;
  models: Models;
  /** Resolves once pragmas are set and migrations are applied. */
  ready: Promise<void>;
  /** The queue this process's writes take turns in (SQLite); null where the database needs none. */
  writeQueue: WriteQueue | null;
  /**
   * Runs a SELECT with `$1`… bind parameters outside any transaction; rows as the driver gives them
   * (lib/server/db-read.ts turns them into attributes). SQLite: on a connection of its own (the
   * reading connection), past Sequelize's query class, which builds an Error (and its stack text) for
   * every statement — a tenth of a web process's CPU under load. Not on Sequelize's default
   * connection: Sequelize runs each of its statements in sqlite3's serialized mode, where a
   * statement waits until no other statement of its connection is running; with these reads on the
   * same connection, a lab under steady load never let it run (a model's query waited until the
   * load stopped: 0.6–3 s on the server-load bench, for ever in tests/api/db-prepared.test.ts).
   * PostgreSQL: through `sequelize.query`.
   */
  select(sql: string, bind: unknown[]): Promise<Record<string, unknown>[]>;
  /**
   * The database's state of writes, to tell whether what was read since may have changed; null
   * where the database has no such mark (PostgreSQL). See ChangeMark.
   */
  changeMark(): Promise<ChangeMark | null>;
  /**
   * Runs `fn` and names the tables its statements named: every Database.select and Sequelize query
   * issued while `fn` runs, in its async context (change-counts.ts, tableNamer). Null where the
   * tables are not known (PostgreSQL; SQLite before its first change mark).
   */
  tablesReadBy<T>(fn: () => Promise<T>): Promise<{ value: T; tables: string[] | null }>;
  /** SQLite: how many SELECTs the reading connection keeps prepared (for tests). */
  preparedCount?(): Promise<number>;
}

/**
 * Where the database's writes stand (Database.changeMark). SQLite: `version` is `PRAGMA
 * data_version` on the reading connection, which counts the commits of every other connection
 * (other processes, and all of this process's writes, which are on Sequelize's connections), with
 * `total_changes()`, the rows the reading connection itself changed (none; it counts for an
 * in-memory database, where reads and writes share one connection), and the schema's version.
 * SQLite docs, pragma.html#pragma_data_version and lang_corefunc.html#total_changes. `tables`:
 * the rows written so far to each counted table (change-counts.ts), all from one snapshot.
 */
export interface ChangeMark {
  /** Differs from an earlier mark's whenever anything was written in between, to any table. */
  version: string;
  /** Rows written so far to each counted table; a table not in it is not counted. */
  tables: ReadonlyMap<string, number>;
}

/** How long a write waits for its turn in the write queue before a 503 (ms), unless configured. */
export const WRITE_WAIT_MS = 10_000;

/** How long a connection waits for another connection's write lock before SQLITE_BUSY (ms). */
export const BUSY_TIMEOUT_MS = 5000;

/** How many prepared SELECTs a connection keeps for Database.select; the least recently used goes first. */
export const PREPARED_PER_CONNECTION = 200;

/**
 * sqlite3 whose every Database (one per Sequelize transaction) waits for locks, and keeps the
 * SELECTs of Database.select prepared. sqlite3's `all(sql)` prepares, runs and finalizes a
 * statement each call: two trips to libuv's thread pool and SQLite's parse and plan every time.
 * A kept statement runs in one trip. Measured on the server-load bench's lab (50 clients, 2 web
 * processes, no readout): 2.20–2.23 ms of server CPU per request without, 1.96–2.04 with.
 */
class BusyWaitingDatabase extends sqlite3.Database {
  /** Each kept SELECT, as the promise of its prepared statement (settled after its first preparation). */
  private readonly prepared = new Map<string, Promise<sqlite3.Statement>>();

  constructor(filename: string, mode?: number, callback?: (err: Error | null) => void) {
    super(filename, mode as number, callback);
    this.configure("busyTimeout", BUSY_TIMEOUT_MS);
  }

  /** The rows of `sql` with named `params`, on a statement prepared at its first use and kept. */
  async allPrepared(sql: string, params: Record<string, unknown>): Promise<Record<string, unknown>[]> {
    let ready = this.prepared.get(sql);
    if (ready) {
      this.prepared.delete(sql); // set again below: the end of the map holds the most recently used
    } else {
      if (this.prepared.size >= PREPARED_PER_CONNECTION) {
        const [oldestSql, oldest] = this.prepared.entries().next().value as [string, Promise<sqlite3.Statement>];
        this.prepared.delete(oldestSql);
        void oldest.then(
          (statement) => statement.finalize(),
          () => undefined,
        );
      }
      // sqlite3 calls back a statement's later `all` only if it was prepared: wait for that first.
      ready = new Promise<sqlite3.Statement>((resolve, reject) => {
        const statement: sqlite3.Statement = this.prepare(sql, (err) => (err ? reject(err) : resolve(statement)));
      });
      // A statement SQLite refused is not kept.
      ready.catch(() => {
        if (this.prepared.get(sql) === ready) this.prepared.delete(sql);
      });
    }
    this.prepared.set(sql, ready);
    const statement = await ready;
    return new Promise((resolve, reject) =>
      statement.all(params, (err: Error | null, rows: Record<string, unknown>[]) =>
        err ? reject(err) : resolve(rows),
      ),
    );
  }

  /** How many statements this connection keeps (for tests). */
  get preparedCount(): number {
    return this.prepared.size;
  }

  /** SQLite closes a connection only once its statements are finalized. */
  override close(callback?: (err: Error | null) => void): void {
    const kept = [...this.prepared.values()];
    this.prepared.clear();
    void Promise.allSettled(kept).then((all) => {
      for (const s of all) if (s.status === "fulfilled") s.value.finalize();
      super.close(callback);
    });
  }
}
const dialectModule = { ...sqlite3, Database: BusyWaitingDatabase };

const READ_TYPES = new Set<string>([
  QueryTypes.SELECT,
  QueryTypes.SHOWTABLES,
  QueryTypes.SHOWINDEXES,
  QueryTypes.DESCRIBE,
  QueryTypes.FOREIGNKEYS,
]);

/** The text of a statement as sequelize.query takes it (a string, or an object with `query`). */
const sqlText = (sql: unknown): string =>
  typeof sql === "string" ? sql : ((sql as { query?: string } | null)?.query ?? "");

/** A statement that only reads: SELECT, or a PRAGMA that sets nothing. */
function isRead(sql: unknown, options: { type?: string } | undefined): boolean {
  if (options?.type && READ_TYPES.has(options.type)) return true;
  const text = sqlText(sql);
  return /^\s*SELECT\b/i.test(text) || /^\s*PRAGMA\s+[\w.]+\s*;?\s*$/i.test(text);
}

/**
 * Routes every transaction and every write outside a transaction through `queue`. Statements
 * inside a transaction carry it in their options and run at once (the transaction holds the
 * turn); an unmanaged transaction (no callback) holds the turn until its commit or rollback.
 */
function installWriteQueue(sequelize: Sequelize, queue: WriteQueue): void {
  const query = sequelize.query.bind(sequelize) as (
    sql: unknown,
    options?: Record<string, unknown>,
  ) => Promise<unknown>;
  const transaction = sequelize.transaction.bind(sequelize) as (...args: unknown[]) => Promise<unknown>;
  Object.assign(sequelize, {
    query: (sql: unknown, options?: { transaction?: unknown; type?: string }) =>
      options?.transaction || isRead(sql, options) ? query(sql, options) : queue.run(() => query(sql, options)),
    transaction: async (...args: unknown[]) => {
      if (args.some((a) => typeof a === "function")) return queue.run(() => transaction(...args));
      // Unmanaged (Sequelize's findOrCreate makes one): the turn ends with its commit or rollback.
      const leave = await queue.acquire();
      try {
        const t = (await transaction(...args)) as Transaction;
        const commit = t.commit.bind(t);
        const rollback = t.rollback.bind(t);
        Object.assign(t, {
          commit: () => commit().finally(leave),
          rollback: () => rollback().finally(leave),
        });
        return t;
      } catch (err) {
        leave();
        throw err;
      }
    },
  });
}

type Options = { migrate?: boolean; writeWaitMs?: number };

/** True when `location` names a PostgreSQL server rather than a SQLite file. */
export function isPostgresUrl(location: string): boolean {
  return /^postgres(ql)?:\/\//i.test(location);
}

/** The location for messages: a URL without its password, or the file path. */
export function describeLocation(location: string): string {
  if (!isPostgresUrl(location)) return location;
  const url = new URL(location);
  if (url.password) url.password = "***";
  return url.toString();
}

/** `location`: a `postgres://` URL, or the path of a SQLite file (created with its folder). */
export function createDatabase(location: string, options: Options = {}): Database {
  return isPostgresUrl(location) ? createPostgres(location, options) : createSqlite(location, options);
}

function createPostgres(url: string, options: Options): Database {
  const sequelize = new Sequelize(url, { dialect: "postgres", dialectModule: pg, logging: false });
  const models = createModels(sequelize);
  const ready = (async () => {
    if (options.migrate !== false) await migrateUp(sequelize);
  })();
  const select = (sql: string, bind: unknown[]) =>
    sequelize.query<Record<string, unknown>>(sql, { bind, type: QueryTypes.SELECT, raw: true });
  return {
    sequelize,
    models,
    ready,
    writeQueue: null,
    select,
    changeMark: async () => null,
    tablesReadBy: async (fn) => ({ value: await fn(), tables: null }),
  };
}

function createSqlite(storage: string, options: Options): Database {
  if (storage !== ":memory:") mkdirSync(path.dirname(storage), { recursive: true });
  // IMMEDIATE: a transaction takes the write lock when it begins. A deferred one that read first
  // and writes later fails with SQLITE_BUSY, whatever the timeout, when another connection wrote in
  // between (a stale read snapshot cannot be upgraded to a write; SQLite docs, "Transaction",
  // lang_transaction.html, from memory); with IMMEDIATE it waits its turn. The test
  // tests/api/db-concurrency.test.ts fails with DEFERRED.
  const sequelize = new Sequelize({
    dialect: "sqlite",
    storage,
    dialectModule,
    logging: false,
    transactionType: Transaction.TYPES.IMMEDIATE,
  });
  const models = createModels(sequelize);
  const writeQueue = createWriteQueue({
    maxWaitMs: options.writeWaitMs ?? WRITE_WAIT_MS,
    what: "too many writes at once",
  });
  installWriteQueue(sequelize, writeQueue);
  const ready = (async () => {
    if (storage !== ":memory:") await sequelize.query("PRAGMA journal_mode = WAL;");
    await sequelize.query("PRAGMA foreign_keys = ON;");
    if (options.migrate !== false) await migrateUp(sequelize);
  })();
  const connections = sequelize.connectionManager as unknown as {
    getConnection(options: { type: string }): Promise<sqlite3.Database>;
  };
  // The reading connection (see Database.select), opened at the first read, query-only, closed
  // with Sequelize. An in-memory database is one per connection: there reads use Sequelize's.
  let reader: Promise<BusyWaitingDatabase> | null = null;
  const readingConnection = () =>
    (reader ??= new Promise<BusyWaitingDatabase>((resolve, reject) => {
      const c: BusyWaitingDatabase = new BusyWaitingDatabase(
        storage,
        sqlite3.OPEN_READWRITE | sqlite3.OPEN_FULLMUTEX,
        (err) => (err ? reject(err) : c.exec("PRAGMA query_only = ON", (e) => (e ? reject(e) : resolve(c)))),
      );
    }));
  const sequelizeClose = sequelize.close.bind(sequelize);
  Object.assign(sequelize, {
    close: async () => {
      await sequelizeClose();
      const opened = reader;
      reader = null;
      const c = await opened?.catch(() => null);
      if (c) await new Promise<void>((resolve) => c.close(() => resolve()));
    },
  });
  const selectConnection = async () =>
    storage === ":memory:"
      ? ((await connections.getConnection({ type: QueryTypes.SELECT })) as BusyWaitingDatabase)
      : readingConnection();
  const readOnly = async (sql: string, bind: unknown[]) => {
    const connection = await selectConnection();
    // Named $1… parameters, as Sequelize binds them for SQLite; booleans as SQLite stores them.
    const params: Record<string, unknown> = {};
    bind.forEach((v, i) => (params[`$${i + 1}`] = typeof v === "boolean" ? Number(v) : v));
    return connection.allPrepared(sql, params).catch((err: Error) => {
      throw Object.assign(new Error(`${err.message} (in ${sql.slice(0, 200)})`), { cause: err });
    });
  };
  // The statements of each Database.tablesReadBy (and of those it runs within), whichever way they are sent.
  // `done`: work `fn` started but did not await (a timer, a write left to finish) keeps its
  // context; what it sends after `fn` returned is not noted, so nothing grows for it.
  type Noting = { statements: string[]; within: Noting | undefined; done: boolean };
  const noting = new AsyncLocalStorage<Noting>();
  const note = (sql: string) => {
    for (let n = noting.getStore(); n; n = n.within) if (!n.done) n.statements.push(sql);
  };
  const queued = sequelize.query.bind(sequelize) as (sql: unknown, options?: unknown) => Promise<unknown>;
  Object.assign(sequelize, {
    query: (sql: unknown, options?: unknown) => {
      note(sqlText(sql));
      return queued(sql, options);
    },
  });
  const select = async (sql: string, bind: unknown[]) => {
    note(sql);
    return readOnly(sql, bind);
  };
  // What the schema says of tables and their counting, read again when the schema's version changes.
  let schema: { version: number; counted: Set<string>; name: (sqlTexts: readonly string[]) => string[] } | null = null;
  let last: ChangeMark | null = null;
  const changeMark = async (): Promise<ChangeMark> => {
    let row: Record<string, unknown>;
    try {
      [row] = await readOnly(
        "SELECT (SELECT data_version FROM pragma_data_version) AS v, total_changes() AS t, " +
          "(SELECT schema_version FROM pragma_schema_version) AS s, " +
          `(SELECT group_concat(table_name || ' ' || changes, ' ') FROM ${CHANGE_COUNTS}) AS c`,
        [],
      );
    } catch {
      // No counts (a database not migrated that far): the version alone, no table counted.
      [row] = await readOnly(
        "SELECT (SELECT data_version FROM pragma_data_version) AS v, total_changes() AS t, " +
          "(SELECT schema_version FROM pragma_schema_version) AS s",
        [],
      );
    }
    const version = `${row.v}.${row.t}.${row.s}`;
    if (last?.version === version) return last;
    let known = schema;
    if (known?.version !== Number(row.s)) {
      const objects = (await readOnly(SCHEMA_OBJECTS_SQL, [])) as unknown as SchemaObject[];
      known = schema = { version: Number(row.s), counted: countedTables(objects), name: tableNamer(tablesOf(objects)) };
    }
    const tables = new Map<string, number>();
    const words = typeof row.c === "string" ? row.c.split(" ") : [];
    for (let i = 0; i + 1 < words.length; i += 2)
      if (known.counted.has(words[i])) tables.set(words[i], Number(words[i + 1]));
    return (last = { version, tables });
  };
  const tablesReadBy = async <T>(fn: () => Promise<T>) => {
    const mine: Noting = { statements: [], within: noting.getStore(), done: false };
    try {
      const value = await noting.run(mine, fn);
      return { value, tables: schema ? schema.name(mine.statements) : null };
    } finally {
      mine.done = true;
    }
  };
  const preparedCount = async () => (await selectConnection()).preparedCount;
  return { sequelize, models, ready, writeQueue, select, changeMark, tablesReadBy, preparedCount };
}
