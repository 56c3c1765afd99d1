/** What every kind's search gets and gives: one query per kind, at most `limit` hits and whether there were more. */
import "server-only";
import type { WhereOptions } from "sequelize";
import type { SearchHit } from "@/lib/contracts/search";
import type { Models } from "@/models";

export interface KindSearch {
  m: Models;
  labId: string;
  /** What the user typed, trimmed. */
  q: string;
  /** A where clause matching `q` inside one qualified column (see textMatcher). */
  match: (column: string) => WhereOptions;
  limit: number;
}

export interface KindFound {
  items: SearchHit[];
  more: boolean;
}

/** Queries ask for one row more than they show, so the answer knows there are more. */
export function fetchSize(s: KindSearch): number {
  return s.limit + 1;
}

export function keepLimit(s: KindSearch, items: SearchHit[]): KindFound {
  return { items: items.slice(0, s.limit), more: items.length > s.limit };
}

/** Newest first, ties by id, so a page of hits is stable. */
export const NEWEST_FIRST = [
  ["createdAt", "DESC"],
  ["id", "ASC"],
] as [string, string][];
