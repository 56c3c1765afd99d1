import type { Metadata } from "next";
import Link from "next/link";
import { LinkButton } from "@/components/ui/button";
import { Badge, PageHeader, Panel } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { listCatalogue } from "@/lib/server/kinetics/catalogue";
import { pageLab } from "@/lib/server/web/page-access";
import { LabKineticsList } from "./lab-kinetics-list";

export const metadata: Metadata = { title: "Kinetics" };
export const dynamic = "force-dynamic";

const range = (min: number | null, max: number | null) => `[${min ?? "−∞"}, ${max ?? "∞"}]`;

export default async function KineticsPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const ctx = await pageLab(labId);
  const canCreate = can(ctx.role, "kinetics.edit");
  const catalogue = listCatalogue();
  return (
    <>
      <PageHeader
        title="Kinetics"
        subtitle="Published reaction–diffusion kinetics and the lab's own. Open one for its dispersion relation, Turing-space map, sensitivities and gradients."
        actions={
          canCreate ? (
            <LinkButton href={`/labs/${labId}/kinetics/new`} data-testid="new-kinetics">
              New kinetics
            </LinkButton>
          ) : null
        }
      />
      <div className="space-y-6">
        <Panel title="The lab's kinetics">
          <LabKineticsList labId={labId} canCreate={canCreate} />
        </Panel>
        <Panel title="Catalogue (published)">
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm" data-testid="catalogue-table">
              <thead className="border-b border-rule text-xs uppercase tracking-wide text-ink-soft">
                <tr>
                  <th className="px-3 py-2 font-medium">Kinetics</th>
                  <th className="px-3 py-2 font-medium">Species</th>
                  <th className="px-3 py-2 font-medium">Parameters (default, range)</th>
                  <th className="px-3 py-2 font-medium">Published source</th>
                </tr>
              </thead>
              <tbody>
                {catalogue.map((k) => (
                  <tr key={k.id} className="border-b border-rule/60 align-top last:border-0">
                    <td className="px-3 py-2">
                      <Link href={`/labs/${labId}/kinetics/${k.id}`} className="font-medium text-moss hover:underline">
                        {k.name}
                      </Link>
                      <div className="num text-xs text-ink-soft">{k.id}</div>
                    </td>
                    <td className="px-3 py-2">
                      <span className="flex flex-wrap gap-1">
                        {k.species.map((s) => (
                          <Badge key={s}>{s}</Badge>
                        ))}
                      </span>
                    </td>
                    <td className="px-3 py-2 text-xs">
                      {k.parameters.map((p) => (
                        <div key={p.name} title={p.meaning}>
                          <span className="num">
                            {p.name} = {p.default}
                          </span>{" "}
                          <span className="num text-ink-soft">{range(p.min, p.max)}</span>
                        </div>
                      ))}
                    </td>
                    <td className="max-w-md px-3 py-2 text-xs text-ink-soft">
                      {k.source}
                      <div className="mt-1 num text-ink">{k.form}</div>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </Panel>
      </div>
    </>
  );
}
