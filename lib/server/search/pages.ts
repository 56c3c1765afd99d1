/** Data for the search results page, one call per page. */
import "server-only";
import { SEARCH_MAX_LIMIT, type SearchAnswer } from "@/lib/contracts/search";
import type { LabContext } from "../access";
import { AppError } from "../errors";
import { parseSearchQuery, searchLab } from "./search";

export interface SearchPageData {
  q: string;
  /** null before anything was searched, or when the text could not be searched. */
  answer: SearchAnswer | null;
  /** Why the text could not be searched, in the page's words ("Search: type at least 2 characters"). */
  problem: string | null;
  /** Hits shown per kind: the most the API gives. */
  limit: number;
}

/** The lab's hits for `q` as the results page shows them: up to the largest limit per kind. */
export async function loadSearchPage(ctx: LabContext, q: string | undefined): Promise<SearchPageData> {
  const text = (q ?? "").trim();
  const base = { q: text, answer: null, problem: null, limit: SEARCH_MAX_LIMIT };
  if (text === "") return base;
  const url = new URL("http://search.invalid/");
  url.searchParams.set("q", text);
  url.searchParams.set("limit", String(SEARCH_MAX_LIMIT));
  let query;
  try {
    query = parseSearchQuery(url.toString());
  } catch (err) {
    if (err instanceof AppError && err.code === "bad_input") return { ...base, problem: err.message };
    throw err;
  }
  return { ...base, answer: await searchLab(ctx, query) };
}
