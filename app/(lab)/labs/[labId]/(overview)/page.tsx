import { formatPlusMinus } from "@/lib/format/measurement";
import Link from "next/link";
import { OpenDiscussions } from "@/components/discussion/open-discussions";
import { LongName } from "@/components/ui/long-name";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { ROLE_LABELS } from "@/lib/access/roles";
import { formatDateTime } from "@/lib/client/format";
import { loadDashboard } from "@/lib/server/labs/dashboard";
import { RunningJobs } from "../fits/running-jobs";
import { pageLab } from "@/lib/server/web/page-access";

export const dynamic = "force-dynamic";

export default async function Dashboard({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const ctx = await pageLab(labId);
  const { studies, fits, readouts, audit } = await loadDashboard(ctx);
  return (
    <div className="space-y-6">
      <PageHeader title={ctx.labName} subtitle={`You are ${ROLE_LABELS[ctx.role].toLowerCase()} here.`} />
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <Panel
          title="Recent studies"
          actions={
            <Link href={`/labs/${labId}/studies`} className="text-sm text-moss hover:underline">
              All studies →
            </Link>
          }
        >
          {studies.total === 0 ? (
            <EmptyState title="No studies yet.">
              {can(ctx.role, "study.create") ? (
                <Link href={`/labs/${labId}/studies`} className="text-moss hover:underline">
                  Create the first study
                </Link>
              ) : (
                "A bench scientist or lab manager creates studies; they will appear here."
              )}
            </EmptyState>
          ) : (
            <ul className="divide-y divide-rule" data-testid="recent-studies">
              {studies.items.map((s) => (
                <li key={s.id} className="flex flex-wrap items-baseline justify-between gap-x-4 py-2">
                  <LongName
                    size="fill"
                    href={`/labs/${labId}/studies/${s.id}`}
                    className="font-medium text-ink hover:text-moss"
                    text={s.name}
                  />
                  <span className="text-right text-sm text-ink-soft">
                    <LongName size="short" text={s.tissue} /> · <LongName size="short" text={s.organism} /> ·{" "}
                    <span className="num">{s.specimenCount}</span> specimens
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel title="Next steps">
          <ul className="space-y-2 text-sm text-ink-soft">
            {can(ctx.role, "upload.create") && (
              <li>
                Upload a stained image or a spacing table to a specimen in a{" "}
                <Link href={`/labs/${labId}/studies`} className="text-moss hover:underline">
                  study
                </Link>
                ; its spacing is read automatically.
              </li>
            )}
            {can(ctx.role, "fit.create") && (
              <li>
                Compare the measured spacing with a model: open a{" "}
                <Link href={`/labs/${labId}/kinetics`} className="text-moss hover:underline">
                  kinetics
                </Link>{" "}
                or start a{" "}
                <Link href={`/labs/${labId}/fits`} className="text-moss hover:underline">
                  fit
                </Link>
                .
              </li>
            )}
            {!can(ctx.role, "upload.create") && (
              <li>
                Read the lab&apos;s{" "}
                <Link href={`/labs/${labId}/readouts`} className="text-moss hover:underline">
                  readouts
                </Link>{" "}
                and{" "}
                <Link href={`/labs/${labId}/fits`} className="text-moss hover:underline">
                  fits
                </Link>
                , and comment at the bottom of each.
              </li>
            )}
            {can(ctx.role, "invitation.manage") && (
              <li>
                <Link href={`/labs/${labId}/members`} className="text-moss hover:underline">
                  Invite your lab
                </Link>{" "}
                with a role each.
              </li>
            )}
            <li>
              Scripts can use the same API with a personal{" "}
              <Link href="/account" className="text-moss hover:underline">
                API token
              </Link>
              .
            </li>
          </ul>
        </Panel>
      </div>
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_20rem]">
        <Panel
          title="Recent fits"
          actions={
            <Link href={`/labs/${labId}/fits`} className="text-sm text-moss hover:underline">
              All fits →
            </Link>
          }
        >
          {fits.total === 0 ? (
            <p className="text-sm text-ink-soft">
              No fits yet.{" "}
              {can(ctx.role, "fit.create") ? (
                <Link href={`/labs/${labId}/fits/new`} className="text-moss hover:underline">
                  Fit a kinetics to your readouts
                </Link>
              ) : (
                "They appear here when a lab member starts one."
              )}
            </p>
          ) : (
            <ul className="divide-y divide-rule text-sm" data-testid="recent-fits">
              {fits.items.map((f) => (
                <li key={f.id} className="flex items-baseline justify-between gap-3 py-1.5">
                  <LongName
                    size="fill"
                    href={`/labs/${labId}/fits/${f.id}`}
                    className="font-medium text-ink hover:text-moss"
                    text={f.name}
                  />
                  <span className="shrink-0 text-xs text-ink-soft">{f.verdict ?? f.status}</span>
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel
          title="Recent readouts"
          actions={
            <Link href={`/labs/${labId}/readouts`} className="text-sm text-moss hover:underline">
              All readouts →
            </Link>
          }
        >
          {readouts.total === 0 ? (
            <p className="text-sm text-ink-soft">
              No readouts yet. Upload an image or spacing table to a specimen; its readout starts by itself.
            </p>
          ) : (
            <ul className="divide-y divide-rule text-sm" data-testid="recent-readouts">
              {readouts.items.map((r) => (
                <li key={r.id} className="flex items-baseline justify-between gap-3 py-1.5">
                  <LongName
                    size="fill"
                    href={`/labs/${labId}/readouts/${r.id}`}
                    className="font-medium text-ink hover:text-moss"
                    text={r.filename}
                  />
                  <span className="num shrink-0 text-xs text-moss">
                    {r.headline?.wavelengthUm != null && r.headline.periodFound ? (
                      formatPlusMinus(r.headline.wavelengthUm, r.headline.uncertaintyUm, "µm")
                    ) : (
                      <span className="text-ink-soft">{r.status}</span>
                    )}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel title="My running jobs">
          <RunningJobs labId={labId} />
        </Panel>
      </div>
      <Panel title="Open discussions">
        <OpenDiscussions labId={labId} />
      </Panel>
      {audit && (
        <Panel
          title="Latest in the audit trail"
          actions={
            <Link href={`/labs/${labId}/audit`} className="text-sm text-moss hover:underline">
              Audit trail →
            </Link>
          }
        >
          <ul className="space-y-1 text-sm">
            {audit.items.map((e) => (
              <li key={e.id} className="flex gap-3">
                <span className="num shrink-0 text-xs text-ink-soft">{formatDateTime(e.at)}</span>
                <span className="min-w-0 [overflow-wrap:anywhere]">{e.summary}</span>
              </li>
            ))}
          </ul>
        </Panel>
      )}
    </div>
  );
}
