/**
 * Lab search: one text, every kind of object of one lab, answered grouped by kind. Each kind is
 * one query scoped to the lab (another lab's objects never match); the kinds run side by side.
 */
import "server-only";
import {
  SEARCH_KIND_LABELS,
  SEARCH_KINDS,
  searchQuerySchema,
  type SearchAnswer,
  type SearchKind,
  type SearchQuery,
} from "@/lib/contracts/search";
import type { LabContext } from "../access";
import { AppError } from "../errors";
import { database } from "../services";
import { searchReadouts, searchSpecimens, searchStudies, searchUploads } from "./hits-data";
import { searchDiscussions, searchFits, searchKinetics, searchRuns } from "./hits-results";
import type { KindFound, KindSearch } from "./kind-search";
import { textMatcher } from "./match";

const SEARCHES: Record<SearchKind, (s: KindSearch) => Promise<KindFound>> = {
  study: searchStudies,
  specimen: searchSpecimens,
  upload: searchUploads,
  readout: searchReadouts,
  kinetics: searchKinetics,
  fit: searchFits,
  run: searchRuns,
  discussion: searchDiscussions,
};

/** The field names of the query as the search box and results page name them. */
const FIELD_WORDS: Record<string, string> = { q: "Search", limit: "Number of results" };

/** `q` and `limit` from a request's URL; bad input is a 400 naming the field in the page's words. */
export function parseSearchQuery(url: string): SearchQuery {
  const p = new URL(url).searchParams;
  const parsed = searchQuerySchema.safeParse({
    q: p.get("q") ?? "",
    ...(p.has("limit") ? { limit: p.get("limit") } : {}),
  });
  if (!parsed.success) {
    const message = parsed.error.issues
      .map((i) => `${FIELD_WORDS[String(i.path[0])] ?? String(i.path[0])}: ${i.message}`)
      .join("; ");
    throw new AppError("bad_input", message);
  }
  return parsed.data;
}

/** Every kind's hits in the lab of `ctx`; only kinds with hits are in the answer. */
export async function searchLab(ctx: LabContext, query: SearchQuery): Promise<SearchAnswer> {
  const m = await database();
  const s: KindSearch = { m, labId: ctx.labId, q: query.q, match: textMatcher(query.q), limit: query.limit };
  const found = await Promise.all(SEARCH_KINDS.map((kind) => SEARCHES[kind](s)));
  return {
    q: query.q,
    groups: SEARCH_KINDS.flatMap((kind, i) =>
      found[i].items.length > 0
        ? [{ kind, label: SEARCH_KIND_LABELS[kind], items: found[i].items, more: found[i].more }]
        : [],
    ),
  };
}
