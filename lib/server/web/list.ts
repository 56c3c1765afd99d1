/** Paginated, sorted, filtered lists: one query format for every list endpoint. */
import "server-only";
import { literal, Op, type Order } from "sequelize";
import { z } from "zod";
import { LIKE_ESCAPE, likePattern } from "../db-read";
import { AppError } from "../errors";
import { services } from "../services";
import { describeIssue } from "./http";

export interface ListQuery<S extends string> {
  page: number;
  pageSize: number;
  sort: S;
  dir: "asc" | "desc";
  q: string;
}

export interface ListResult<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

export const MAX_PAGE_SIZE = 200;

/**
 * One page of a list query for db-read's `readPage`: its sort with ties broken by id (so pages never
 * overlap or skip a row), its size and offset.
 */
export function readPageOptions(q: ListQuery<string>) {
  return {
    order: [
      [q.sort, q.dir],
      ["id", "asc"],
    ] as [string, "asc" | "desc"][],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  };
}

/**
 * One page of a list query as Sequelize options: readPageOptions' sort, size and offset. `order`
 * replaces the sort where a list needs its own.
 */
export function pageOptions(q: ListQuery<string>, order?: Order) {
  const page = readPageOptions(q);
  return { ...page, order: order ?? (page.order as Order) };
}

/** A list answer: one page of items with the page, its size and the total count. */
export function pageResult<T>(q: ListQuery<string>, items: T[], total: number): ListResult<T> {
  return { items, page: q.page, pageSize: q.pageSize, total };
}

/**
 * The schema of one list's query, built once per list (its sorts and defaults): zod compiles a
 * schema's parser on its first use, and a schema built per request cost about 0.13 ms of CPU each
 * time (tests/bench, the server under load).
 */
const listSchemas = new Map<string, ReturnType<typeof listSchema>>();

function listSchema(sortable: readonly string[], defaultSort: string, defaultDir: "asc" | "desc") {
  return z.object({
    page: z.coerce.number().int().min(1).default(1),
    pageSize: z.coerce.number().int().min(1).max(MAX_PAGE_SIZE).default(25),
    sort: z.enum(sortable as [string, ...string[]]).default(defaultSort),
    dir: z.enum(["asc", "desc"]).default(defaultDir),
    // A NUL or other control character would end or garble the SQL text; nobody types one.
    q: z
      .string()
      .max(200)
      .regex(/^[^\u0000-\u001f\u007f]*$/, "remove control characters from the search text")
      .default(""),
  });
}

export function parseListQuery<S extends string>(
  url: string,
  sortable: readonly S[],
  defaultSort: S,
  defaultDir: "asc" | "desc" = "desc",
): ListQuery<S> {
  const p = new URL(url).searchParams;
  const key = JSON.stringify([sortable, defaultSort, defaultDir]);
  let schema = listSchemas.get(key);
  if (!schema) listSchemas.set(key, (schema = listSchema(sortable, defaultSort, defaultDir)));
  const parsed = schema.safeParse(
    Object.fromEntries([...p.entries()].filter(([k]) => ["page", "pageSize", "sort", "dir", "q"].includes(k))),
  );
  if (!parsed.success) {
    throw new AppError("bad_input", parsed.error.issues.map((i) => describeIssue(i)).join("; "));
  }
  return parsed.data as ListQuery<S>;
}

/**
 * A where-clause value matching text that contains `q` literally, ignoring letter case: `%` and
 * `_` in what the user typed are escaped, so `?q=_` finds an underscore rather than every row.
 * `LIKE … ESCAPE '!'` is standard SQL (SQLite and PostgreSQL both accept it); the pattern is a
 * quoted literal with `'` doubled, the standard SQL string escape (and parseListQuery has refused
 * control characters).
 *
 * The one dialect difference here is documented, not chosen: SQLite's LIKE ignores the case of
 * ASCII letters (sqlite.org/lang_expr.html#like), PostgreSQL's LIKE respects case and ILIKE is its
 * case-insensitive form (postgresql.org/docs/15/functions-matching.html), which SQLite lacks. A
 * value cannot lower-case the column it is compared with, so each gets its own operator.
 */
export function containsText(q: string) {
  const pattern = likePattern(q);
  const op = services().db.sequelize.getDialect() === "postgres" ? Op.iLike : Op.like;
  return { [op]: literal(`'${pattern.replace(/'/g, "''")}' ESCAPE '${LIKE_ESCAPE}'`) };
}
