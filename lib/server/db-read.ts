/**
 * Reads on the hot paths (every request's token and membership, the lists and details that a lab's
 * pages poll) as SELECTs written out, with plain objects back instead of model instances.
 *
 * Why: a `findAll` of 20 readouts costs about 1.3 ms of CPU in Sequelize (the query built from its
 * options, then an instance per row with lodash clones of every value) against 0.1 ms for the same
 * SELECT in sqlite3 (measured on this machine; the server-load bench's figures are in issue
 * "Speed"). Writes, and reads off the hot paths, keep the models.
 *
 * The SQL runs through `sequelize.query` with `$1`-style bind parameters, so it is portable to
 * PostgreSQL (the same statements, the same models' tables), and the values come back as the models
 * would give them: `rowOf` maps each column to its attribute name (the tables are `underscored`) and
 * turns SQLite's text dates, 0/1 booleans and JSON text into Date, boolean and parsed JSON, as the
 * PostgreSQL driver already does.
 */
import "server-only";
import { DataTypes, QueryTypes, type Model, type ModelStatic } from "sequelize";
import { database, services } from "./services";

type Kind = "date" | "boolean" | "json" | "number" | "plain";
interface Column {
  attribute: string;
  field: string;
  kind: Kind;
}

const columnsByModel = new WeakMap<object, Column[]>();

function kindOf(type: unknown): Kind {
  if (type instanceof DataTypes.DATE) return "date";
  if (type instanceof DataTypes.BOOLEAN) return "boolean";
  if (type instanceof DataTypes.JSON) return "json";
  // PostgreSQL gives BIGINT and DECIMAL as strings; the models use numbers.
  if (type instanceof DataTypes.BIGINT || type instanceof DataTypes.DECIMAL) return "number";
  return "plain";
}

/** Each attribute of a model with its column and how its value comes back from the driver. */
function columnsOf(model: ModelStatic<Model>): Column[] {
  let columns = columnsByModel.get(model);
  if (!columns) {
    columns = Object.entries(model.getAttributes()).map(([attribute, def]) => ({
      attribute,
      field: def.field ?? attribute,
      kind: kindOf(def.type),
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
      // SQLite keeps JSON as text; the PostgreSQL driver parses it already (and a JSON string stays a string).
      return typeof v === "string" && sqlite() ? JSON.parse(v) : v;
    case "number":
      return typeof v === "number" ? v : Number(v);
    default:
      return v;
  }
}

const sqlite = () => services().db.sequelize.getDialect() === "sqlite";

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
  return services().db.sequelize.query<Record<string, unknown>>(sql, { bind, type: QueryTypes.SELECT, raw: true });
}

/** The table of a model, quoted. */
export function tableOf(model: ModelStatic<Model>): string {
  const t = model.getTableName();
  return typeof t === "string" ? `"${t}"` : `"${t.tableName}"`;
}
