import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { LinkButton } from "@/components/ui/button";
import { can } from "@/lib/access/permissions";
import { Badge, PageHeader, Panel } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import { isUuid } from "@/lib/server/access";
import { type KineticsVersionDto, type LabKineticsDto } from "@/lib/server/kinetics/kinetics";
import { getCatalogueEntry, type KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import { loadLabKineticsPage } from "@/lib/server/kinetics/pages";
import { AppError } from "@/lib/server/errors";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { AnalysisView } from "../analysis-view";
import { DeleteKineticsButton } from "../delete-kinetics-button";

export const metadata: Metadata = { title: "Kinetics" };
export const dynamic = "force-dynamic";

export default async function KineticsAnalysisPage({
  params,
  searchParams,
}: {
  params: Promise<{ labId: string; kineticsId: string }>;
  searchParams: Promise<{ version?: string }>;
}) {
  const { labId, kineticsId } = await params;
  const { version: rawVersion } = await searchParams;
  const ctx = await pageLab(labId);
  let info: KineticsInfoDto;
  let lab: LabKineticsDto | null = null;
  let versions: KineticsVersionDto[] = [];
  if (isUuid(kineticsId)) {
    const asked = rawVersion && /^\d+$/.test(rawVersion) ? Number(rawVersion) : undefined;
    ({ lab, info, versions } = await orNotFound(loadLabKineticsPage(ctx, kineticsId, asked)));
  } else {
    try {
      info = getCatalogueEntry(kineticsId);
    } catch (err) {
      if (err instanceof AppError && err.code === "not_found") notFound();
      throw err;
    }
  }
  const n = info.species.length;
  return (
    <>
      <PageHeader
        crumbs={
          <Link href={`/labs/${labId}/kinetics`} className="hover:underline">
            Kinetics
          </Link>
        }
        title={info.name}
        subtitle={
          lab ? (
            <>
              <span data-testid="kinetics-version">Version {info.version}</span> of {lab.latestVersion} · by{" "}
              {lab.createdByEmail ?? "a former member"} · {n} species
            </>
          ) : (
            <>{info.source}</>
          )
        }
        actions={
          <>
            {can(ctx.role, "fit.create") && (
              <LinkButton
                variant="secondary"
                href={`/labs/${labId}/fits/new?kinetics=${kineticsId}${lab ? `&version=${info.version}` : ""}`}
                data-testid="fit-this-kinetics"
              >
                Fit this kinetics
              </LinkButton>
            )}
            {lab?.canEdit ? (
              <>
                <LinkButton
                  variant="secondary"
                  href={`/labs/${labId}/kinetics/${kineticsId}/edit`}
                  data-testid="edit-kinetics"
                >
                  Edit (new version)
                </LinkButton>
                <DeleteKineticsButton labId={labId} kineticsId={kineticsId} name={lab.name} />
              </>
            ) : null}
          </>
        }
      />
      <div className="mb-6 grid gap-6 lg:grid-cols-[1fr_24rem]">
        <Panel title="Equations">
          <div className="num space-y-1 text-sm">
            {info.species.map((s, i) => (
              <div key={s}>
                ∂{s}/∂t = {info.reactions[i]} +{" "}
                {info.diffusion[i]
                  .map((d, j) => (d === "0" ? null : `${d}·∇²${info.species[j]}`))
                  .filter(Boolean)
                  .join(" + ")}
              </div>
            ))}
          </div>
          <p className="mt-2 text-xs text-ink-soft">
            {info.units === "dimensional"
              ? "Dimensional: diffusivities in µm²/s, rates in 1/s."
              : "Non-dimensional: give a length scale ℓ (µm) and time scale τ (s) for physical numbers."}{" "}
            {info.form && <span className="num">{info.form}</span>}
          </p>
        </Panel>
        {lab && (
          <Panel title="Versions">
            <table className="w-full text-sm" data-testid="versions-table">
              <tbody>
                {versions.map((v) => (
                  <tr key={v.version} className="border-b border-rule/60 last:border-0">
                    <td className="py-1 pr-2">
                      <Link
                        href={`/labs/${labId}/kinetics/${kineticsId}?version=${v.version}`}
                        className={`num ${v.version === info.version ? "font-semibold text-ink" : "text-moss hover:underline"}`}
                      >
                        v{v.version}
                      </Link>
                      {v.version === lab.latestVersion && (
                        <span className="ml-1">
                          <Badge>latest</Badge>
                        </span>
                      )}
                    </td>
                    <td className="py-1 text-xs text-ink-soft">{v.createdByEmail ?? "—"}</td>
                    <td className="num py-1 text-right text-xs text-ink-soft">{formatDateTime(v.createdAt)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </Panel>
        )}
      </div>
      <AnalysisView
        key={`${info.id}@${info.version ?? 0}`}
        labId={labId}
        info={info}
        canSimulate={can(ctx.role, "run.create")}
      />
    </>
  );
}
