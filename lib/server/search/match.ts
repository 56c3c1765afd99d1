/**
 * Text matching for lab search that answers the same on SQLite and PostgreSQL: a value matches
 * when it contains what the user typed, ignoring the case of the letters A–Z, and `%` and `_` are
 * literal characters, not wildcards.
 *
 * Why not `containsText` (lib/server/web/list.ts), which the lists use: PostgreSQL's ILIKE folds
 * the case of every letter (É = é), SQLite's LIKE only of ASCII letters
 * (sqlite.org/lang_expr.html#like), so the same search would find different things on the two
 * databases. Here both fold ASCII only: SQLite's LIKE as it is, PostgreSQL's LIKE on the column
 * with A–Z translated to a–z (`translate`, postgresql.org/docs/15/functions-string.html), against
 * a pattern folded the same way. Other letters match as typed on both.
 */
import "server-only";
import { col, fn, literal, Op, where, type WhereOptions } from "sequelize";
import { services } from "../services";

const ESCAPE = "!";
const UPPER = "ABCDEFGHIJKLMNOPQRSTUVWXYZ";
const LOWER = UPPER.toLowerCase();

/** `s` with A–Z made a–z and nothing else changed, as both databases compare it. */
export function foldAscii(s: string): string {
  return s.replace(/[A-Z]/g, (c) => c.toLowerCase());
}

/** Whether `value` contains `q` by the same rule as {@link textMatcher}, for lists held in memory. */
export function containsFolded(value: string | null | undefined, q: string): boolean {
  return !!value && foldAscii(value).includes(foldAscii(q));
}

/**
 * A function from a qualified column name (`"upload"."filename"` written `upload.filename`: the
 * query's table alias, then the column as stored) to a where clause matching `q` inside it.
 * The pattern is a quoted literal with `'` doubled, the standard SQL string escape; the search
 * query refused control characters before this point.
 */
export function textMatcher(q: string): (column: string) => WhereOptions {
  const pattern = `%${foldAscii(q).replace(/[!%_]/g, (c) => ESCAPE + c)}%`;
  const value = literal(`'${pattern.replace(/'/g, "''")}' ESCAPE '${ESCAPE}'`);
  const postgres = services().db.sequelize.getDialect() === "postgres";
  return (column) =>
    postgres
      ? where(fn("translate", col(column), UPPER, LOWER), { [Op.like]: value })
      : where(col(column), { [Op.like]: value });
}

/** Any of the columns matches. */
export function anyColumnMatches(match: (column: string) => WhereOptions, columns: string[]): WhereOptions {
  return { [Op.or]: columns.map(match) };
}
