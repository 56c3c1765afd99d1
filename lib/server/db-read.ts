/**
 * Reads on the hot paths (every request's token and membership, the lists and details that a lab's
 * pages poll) as SELECTs written out, with plain objects back instead of model instances.
 *
 * Why: a `findAll` of 20 readouts costs about 1.3 ms of CPU in Sequelize (the query built from its
 * options, then an instance per row with lodash clones of every value) against 0.1 ms for the same
 * SELECT in sqlite3 (measured on this machine; the server-load bench's figures are in issue
 * "Speed"). Writes, and reads off the hot paths, keep the models.
 *
 * The SQL runs with `$1`-style bind parameters (Database.select in db.ts: SQLite's own connection, or
 * `sequelize.query` on PostgreSQL), portable to both (the same statements, the same models' tables),
 * and the values come back as the models
 * would give them: `rowOf` maps each column to its attribute name (the tables are `underscored`) and
 * turns SQLite's text dates, 0/1 booleans and JSON text into Date, boolean and parsed JSON, as the
 * PostgreSQL driver already does.
 */
import "server-only";
import { DataTypes, Op, type InferAttributes, type Model, type ModelStatic } from "sequelize";
import { database, services } from "./services";

type Kind = "date" | "boolean" | "json" | "number" | "plain";
interface Column {
  attribute: string;
  field: string;
  kind: Kind;
}

const columnsByModel = new WeakMap<object, Column[]>();

/** How a column's value comes back; JSON is text only on SQLite (the PostgreSQL driver parses it). */
function kindOf(type: unknown, sqlite: boolean): Kind {
  if (type instanceof DataTypes.DATE) return "date";
  if (type instanceof DataTypes.BOOLEAN) return "boolean";
  if (type instanceof DataTypes.JSON) return sqlite ? "json" : "plain";
  // PostgreSQL gives BIGINT and DECIMAL as strings; the models use numbers.
  if (type instanceof DataTypes.BIGINT || type instanceof DataTypes.DECIMAL) return "number";
  return "plain";
}

/** Each attribute of a model with its column and how its value comes back from the driver. */
function columnsOf(model: ModelStatic<Model>): Column[] {
  let columns = columnsByModel.get(model);
  if (!columns) {
    const sqlite = isSqlite(model);
    columns = Object.entries(model.getAttributes()).map(([attribute, def]) => ({
      attribute,
      field: def.field ?? attribute,
      kind: kindOf(def.type, sqlite),
    }));
    columnsByModel.set(model, columns);
  }
  return columns;
}

function valueOf(kind: Kind, v: unknown): unknown {
  if (v === null || v === undefined) return null;
  switch (kind) {
    case "date":
      return v instanceof Date ? v : new Date(typeof v === "string" ? sqliteDate(v) : (v as number));
    case "boolean":
      return typeof v === "boolean" ? v : Number(v) !== 0;
    case "json":
      return typeof v === "string" ? JSON.parse(v) : v;
    case "number":
      return typeof v === "number" ? v : Number(v);
    default:
      return v;
  }
}

/** A model's dialect is its Sequelize instance's, fixed for the model's life. */
const isSqlite = (model: ModelStatic<Model>) => model.sequelize?.getDialect() === "sqlite";

/** SQLite keeps Sequelize's dates as "2026-12-04 19:40:00.123 +00:00"; Date parses the ISO form. */
function sqliteDate(s: string): string {
  const m = /^(\d{4}-\d\d-\d\d) (\d\d:\d\d:\d\d(?:\.\d+)?) ?([+-]\d\d:\d\d|Z)?$/.exec(s);
  return m ? `${m[1]}T${m[2]}${m[3] ?? "Z"}` : s;
}

/**
 * The columns of `model` for a SELECT list, each as `"<alias>"."<column>" AS "<prefix><attribute>"`,
 * so a join can take two models' columns apart again with `rowOf(model, row, prefix)`.
 */
export function selectList(model: ModelStatic<Model>, alias: string, prefix = "", only?: readonly string[]): string {
  return columnsOf(model)
    .filter((c) => !only || only.includes(c.attribute))
    .map((c) => `"${alias}"."${c.field}" AS "${prefix}${c.attribute}"`)
    .join(", ");
}

/** One model's attributes out of a row selected with `selectList(model, alias, prefix)`. */
export function rowOf<T>(model: ModelStatic<Model>, row: Record<string, unknown>, prefix = ""): T {
  const out: Record<string, unknown> = {};
  for (const c of columnsOf(model)) {
    const key = prefix + c.attribute;
    if (key in row) out[c.attribute] = valueOf(c.kind, row[key]);
  }
  return out as T;
}

/** Runs a SELECT with `$1`… bind parameters; rows as the driver gives them. */
export async function select(sql: string, bind: unknown[]): Promise<Record<string, unknown>[]> {
  await database();
  return services().db.select(sql, bind);
}

/** The table of a model, quoted. */
export function tableOf(model: ModelStatic<Model>): string {
  const t = model.getTableName();
  return typeof t === "string" ? `"${t}"` : `"${t.tableName}"`;
}

/** A where-clause key: rows whose text in any of `attributes` contains `text` (see `likePattern`). */
export const CONTAINS_TEXT = Symbol("contains text");

/** The escape character of LIKE patterns: not a backslash, which SQL dialects treat differently. */
export const LIKE_ESCAPE = "!";

/** A LIKE pattern matching text that contains `q` literally (`%` and `_` typed by the user escaped). */
export function likePattern(q: string): string {
  return `%${q.replace(/[!%_]/g, (c) => LIKE_ESCAPE + c)}%`;
}

type Scalar = string | number | boolean;
type Condition = Scalar | null | readonly Scalar[] | { [op: symbol]: Scalar | null | readonly Scalar[] };
/**
 * The where clauses the hot paths use: attribute = value, IN (an array), IS NULL (null), a few
 * operators (Op.ne, Op.in, Op.notIn, Op.is, Op.not, Op.gt, Op.gte, Op.lt, Op.lte), Op.or / Op.and
 * of such clauses, and CONTAINS_TEXT. Anything else throws, so a clause is never dropped silently.
 */
export type ReadWhere = {
  [attribute: string]: Condition;
} & {
  [Op.or]?: ReadWhere[];
  [Op.and]?: ReadWhere[];
  [CONTAINS_TEXT]?: { attributes: readonly string[]; text: string };
};

export interface ReadOptions {
  where: ReadWhere;
  attributes?: readonly string[];
  order?: readonly (readonly [string, "asc" | "desc" | "ASC" | "DESC"])[];
  limit?: number;
  offset?: number;
}

const COMPARISONS = new Map<symbol, string>([
  [Op.eq, "="],
  [Op.ne, "<>"],
  [Op.gt, ">"],
  [Op.gte, ">="],
  [Op.lt, "<"],
  [Op.lte, "<="],
]);

class Sql {
  readonly bind: unknown[] = [];
  constructor(
    readonly model: ModelStatic<Model>,
    readonly alias: string,
  ) {}

  param(v: unknown): string {
    if (v instanceof Date || (typeof v === "object" && v !== null))
      throw new Error("db-read: bind a string, number or boolean (dates are stored per dialect)");
    this.bind.push(v);
    return `$${this.bind.length}`;
  }

  column(attribute: string): string {
    const c = columnsOf(this.model).find((x) => x.attribute === attribute);
    if (!c) throw new Error(`db-read: ${this.model.name} has no attribute ${attribute}`);
    return `"${this.alias}"."${c.field}"`;
  }

  list(values: readonly unknown[]): string {
    return values.map((v) => this.param(v)).join(", ");
  }

  condition(col: string, v: Condition): string {
    if (v === null) return `${col} IS NULL`;
    if (Array.isArray(v)) return v.length ? `${col} IN (${this.list(v)})` : "1 = 0";
    if (typeof v !== "object") return `${col} = ${this.param(v)}`;
    const parts = Object.getOwnPropertySymbols(v).map((op) => {
      const x = (v as Record<symbol, Scalar | null | readonly Scalar[]>)[op];
      if (op === Op.in) return this.condition(col, x as readonly Scalar[]);
      if (op === Op.notIn)
        return (x as readonly Scalar[]).length ? `${col} NOT IN (${this.list(x as readonly Scalar[])})` : "1 = 1";
      if (op === Op.is && x === null) return `${col} IS NULL`;
      if (op === Op.not && x === null) return `${col} IS NOT NULL`;
      if (op === Op.ne && x === null) return `${col} IS NOT NULL`;
      const cmp = COMPARISONS.get(op);
      if (cmp && x !== null && !Array.isArray(x)) return `${col} ${cmp} ${this.param(x)}`;
      throw new Error(`db-read: the operator ${String(op)} is not supported here`);
    });
    if (!parts.length || Object.keys(v).length) throw new Error("db-read: a condition object needs operators");
    return parts.join(" AND ");
  }

  where(w: ReadWhere): string {
    const parts: string[] = [];
    for (const [attribute, v] of Object.entries(w)) parts.push(this.condition(this.column(attribute), v));
    for (const key of Object.getOwnPropertySymbols(w)) {
      if (key === Op.or || key === Op.and) {
        const subs = ((w as Record<symbol, ReadWhere[] | undefined>)[key] ?? []).map((x) => `(${this.where(x)})`);
        parts.push(
          subs.length ? `(${subs.join(key === Op.or ? " OR " : " AND ")})` : key === Op.or ? "1 = 0" : "1 = 1",
        );
      } else if (key === CONTAINS_TEXT) {
        const { attributes, text } = w[CONTAINS_TEXT]!;
        // SQLite's LIKE ignores the case of ASCII letters; PostgreSQL's ILIKE is its case-insensitive form.
        const like = isSqlite(this.model) ? "LIKE" : "ILIKE";
        const p = this.param(likePattern(text));
        parts.push(`(${attributes.map((a) => `${this.column(a)} ${like} ${p} ESCAPE '${LIKE_ESCAPE}'`).join(" OR ")})`);
      } else throw new Error(`db-read: the where key ${String(key)} is not supported here`);
    }
    return parts.length ? parts.join(" AND ") : "1 = 1";
  }
}

type Attributes<M extends Model> = InferAttributes<M>;

/** Like `model.findAll` for the options above, with plain objects back (only `attributes`, when given). */
export async function readAll<M extends Model>(model: ModelStatic<M>, o: ReadOptions): Promise<Attributes<M>[]> {
  const rows = await selectRows(model as ModelStatic<Model>, o, "");
  return rows.map((row) => rowOf<Attributes<M>>(model as ModelStatic<Model>, row));
}

/** The SELECT of `readAll`, with `extra` columns after the model's. */
function selectRows(model: ModelStatic<Model>, o: ReadOptions, extra: string) {
  const q = new Sql(model, "r");
  const cond = q.where(o.where);
  const order = o.order?.length
    ? ` ORDER BY ${o.order.map(([a, dir]) => `${q.column(a)} ${dir.toUpperCase() === "DESC" ? "DESC" : "ASC"}`).join(", ")}`
    : "";
  const page =
    (o.limit !== undefined ? ` LIMIT ${Math.trunc(o.limit)}` : "") +
    (o.offset ? ` OFFSET ${Math.trunc(o.offset)}` : "");
  return select(
    `SELECT ${selectList(model, "r", "", o.attributes)}${extra} FROM ${tableOf(model)} "r" WHERE ${cond}${order}${page}`,
    q.bind,
  );
}

/** Every attribute of `model` but `except`: for a list that leaves out the columns holding a whole object. */
export function attributesExcept(model: ModelStatic<Model>, except: readonly string[]): string[] {
  return columnsOf(model)
    .map((c) => c.attribute)
    .filter((a) => !except.includes(a));
}

/**
 * `rows` read without the `attributes` columns, with them added (one query) to the rows `needs`
 * picks: a list reads a stored summary, and only rows written before it had one read the whole.
 */
export async function withColumns<M extends Model>(
  model: ModelStatic<M>,
  rows: Attributes<M>[],
  needs: (row: Attributes<M>) => boolean,
  attributes: readonly string[],
): Promise<Attributes<M>[]> {
  const idOf = (row: unknown) => (row as { id: string }).id;
  const ids = rows.filter(needs).map(idOf);
  if (!ids.length) return rows;
  const read = await readAll(model, { where: { id: ids }, attributes: ["id", ...attributes] });
  const full = new Map(read.map((row) => [idOf(row), row]));
  return rows.map((row) => ({ ...row, ...full.get(idOf(row)) }));
}

/** Like `model.findOne`: the first row or null. */
export async function readOne<M extends Model>(
  model: ModelStatic<M>,
  o: Omit<ReadOptions, "limit" | "offset">,
): Promise<Attributes<M> | null> {
  return (await readAll(model, { ...o, limit: 1 }))[0] ?? null;
}

/** Like `model.count`. */
export async function readCount<M extends Model>(model: ModelStatic<M>, where: ReadWhere): Promise<number> {
  const q = new Sql(model as ModelStatic<Model>, "r");
  const cond = q.where(where);
  const [row] = await select(
    `SELECT count(*) AS "count" FROM ${tableOf(model as ModelStatic<Model>)} "r" WHERE ${cond}`,
    q.bind,
  );
  return Number(row.count); // PostgreSQL's count is a bigint, given as a string
}

/**
 * Like `model.findAndCountAll`: one page of rows and the count of all that match, in one SELECT
 * (`count(*) OVER ()`, a window function of SQLite ≥ 3.25 and PostgreSQL, counted before LIMIT).
 * A page past the end has no row to carry the count; only then is it counted on its own.
 */
export async function readPage<M extends Model>(
  model: ModelStatic<M>,
  o: ReadOptions,
): Promise<{ rows: Attributes<M>[]; count: number }> {
  const raw = await selectRows(model as ModelStatic<Model>, o, `, count(*) OVER () AS "${TOTAL}"`);
  const count = raw.length ? Number(raw[0][TOTAL]) : o.offset ? await readCount(model, o.where) : 0;
  return { rows: raw.map((row) => rowOf<Attributes<M>>(model as ModelStatic<Model>, row)), count };
}

/** The column of readPage's count; no attribute starts with a space. */
const TOTAL = " total";
