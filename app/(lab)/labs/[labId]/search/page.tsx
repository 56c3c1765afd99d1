import Link from "next/link";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { buttonClass } from "@/components/ui/button";
import { loadSearchPage } from "@/lib/server/search/pages";
import { pageLab } from "@/lib/server/web/page-access";

export default async function SearchPage({
  params,
  searchParams,
}: {
  params: Promise<{ labId: string }>;
  searchParams: Promise<{ q?: string | string[] }>;
}) {
  const { labId } = await params;
  const ctx = await pageLab(labId);
  const raw = (await searchParams).q;
  const data = await loadSearchPage(ctx, Array.isArray(raw) ? raw[0] : raw);
  const total = data.answer?.groups.reduce((n, g) => n + g.items.length, 0) ?? 0;
  return (
    <div className="space-y-6">
      <PageHeader
        title="Search"
        subtitle="Studies, specimens, uploads, readouts, kinetics, fits, runs and discussions of this lab."
      />
      <form method="get" action={`/labs/${labId}/search`} role="search" className="flex max-w-xl gap-2">
        <label className="flex-1">
          <span className="sr-only">Search</span>
          <input
            type="search"
            name="q"
            defaultValue={data.q}
            placeholder="Part of a name, file name, condition, stage, genotype or comment"
            className="w-full rounded-md border border-rule bg-card px-3 py-2 text-sm text-ink placeholder:text-ink-soft/60 focus:border-moss focus:outline-none"
            data-testid="search-page-input"
          />
        </label>
        <button type="submit" className={buttonClass("primary")}>
          Search
        </button>
      </form>
      {data.problem && (
        <p className="text-sm text-brick" role="alert" data-testid="search-problem">
          {data.problem}
        </p>
      )}
      {data.answer && data.answer.groups.length === 0 && (
        <EmptyState title={`Nothing in this lab matches “${data.answer.q}”.`}>
          Try part of a file name, a specimen&apos;s condition, a fit&apos;s name or a word from a comment.
        </EmptyState>
      )}
      {data.answer && data.answer.groups.length > 0 && (
        <p className="text-sm text-ink-soft" data-testid="search-summary">
          {total} result{total === 1 ? "" : "s"} for “{data.answer.q}”
        </p>
      )}
      {data.answer?.groups.map((g) => (
        <Panel key={g.kind} title={`${g.label} (${g.items.length}${g.more ? "+" : ""})`}>
          <ul className="divide-y divide-rule/70" data-testid={`search-group-${g.kind}`}>
            {g.items.map((hit) => (
              <li key={hit.id} className="min-w-0 py-2">
                <Link href={hit.href} title={hit.name} className="block truncate font-medium text-moss hover:underline">
                  {hit.name}
                </Link>
                <p className="truncate text-xs text-ink-soft" title={hit.context}>
                  {hit.context}
                </p>
              </li>
            ))}
          </ul>
          {g.more && (
            <p className="mt-2 text-xs text-ink-soft">
              Showing the first {data.limit}; type more of the name to narrow the search.
            </p>
          )}
        </Panel>
      ))}
    </div>
  );
}
