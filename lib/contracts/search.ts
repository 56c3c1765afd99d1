/** Lab search: the query a person types and the grouped answer (API, header box and results page). */
import { z } from "zod";

/** Shortest text searched: one letter would match most of a lab. */
export const SEARCH_MIN_CHARS = 2;
export const SEARCH_MAX_CHARS = 200;
/** Hits per kind: the header box asks for a few, the results page for more. */
export const SEARCH_DEFAULT_LIMIT = 5;
export const SEARCH_MAX_LIMIT = 50;

export const searchQuerySchema = z.object({
  q: z
    .string({ error: "type what to search for" })
    .trim()
    .min(SEARCH_MIN_CHARS, `type at least ${SEARCH_MIN_CHARS} characters`)
    .max(SEARCH_MAX_CHARS, `at most ${SEARCH_MAX_CHARS} characters`)
    // A control character would end or garble the SQL text; nobody types one.
    .regex(/^[^\u0000-\u001f\u007f]*$/, "remove control characters"),
  limit: z.coerce
    .number({ error: `a whole number from 1 to ${SEARCH_MAX_LIMIT}` })
    .int(`a whole number from 1 to ${SEARCH_MAX_LIMIT}`)
    .min(1, `a whole number from 1 to ${SEARCH_MAX_LIMIT}`)
    .max(SEARCH_MAX_LIMIT, `at most ${SEARCH_MAX_LIMIT}`)
    .default(SEARCH_DEFAULT_LIMIT),
});
export type SearchQuery = z.output<typeof searchQuerySchema>;

/** The kinds searched, in the order the answer groups them. */
export const SEARCH_KINDS = ["study", "specimen", "upload", "readout", "kinetics", "fit", "run", "discussion"] as const;
export type SearchKind = (typeof SEARCH_KINDS)[number];

/** A group's heading as a page shows it. */
export const SEARCH_KIND_LABELS: Record<SearchKind, string> = {
  study: "Studies",
  specimen: "Specimens",
  upload: "Uploads",
  readout: "Readouts",
  kinetics: "Kinetics",
  fit: "Fits",
  run: "Runs",
  discussion: "Discussions",
};

export interface SearchHit {
  kind: SearchKind;
  id: string;
  name: string;
  /** One short line that tells hits apart: the specimen and condition of an upload, a fit's status. */
  context: string;
  /** The page of the object, inside the lab. */
  href: string;
}

export interface SearchGroup {
  kind: SearchKind;
  label: string;
  items: SearchHit[];
  /** More matches than `limit`: the results page shows more. */
  more: boolean;
}

export interface SearchAnswer {
  q: string;
  /** Only kinds with at least one hit, in SEARCH_KINDS order; empty when nothing matched. */
  groups: SearchGroup[];
}
