/** Paginated, sorted, filtered lists: one query format for every list endpoint. */
import { z } from "zod";
import { AppError } from "./errors";

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

export function parseListQuery<S extends string>(url: string, sortable: readonly S[], defaultSort: S, defaultDir: "asc" | "desc" = "desc"): ListQuery<S> {
  const p = new URL(url).searchParams;
  const schema = z.object({
    page: z.coerce.number().int().min(1).default(1),
    pageSize: z.coerce.number().int().min(1).max(MAX_PAGE_SIZE).default(25),
    sort: z.enum(sortable as unknown as [S, ...S[]]).default(defaultSort),
    dir: z.enum(["asc", "desc"]).default(defaultDir),
    q: z.string().max(200).default(""),
  });
  const parsed = schema.safeParse(Object.fromEntries([...p.entries()].filter(([k]) => ["page", "pageSize", "sort", "dir", "q"].includes(k))));
  if (!parsed.success) {
    throw new AppError("bad_input", parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; "));
  }
  return parsed.data as ListQuery<S>;
}
