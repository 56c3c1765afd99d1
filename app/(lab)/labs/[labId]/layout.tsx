import { notFound } from "next/navigation";
import { AppShell } from "@/components/layout/app-shell";
import { getMe } from "@/lib/server/accounts/accounts";
import { labNav } from "@/lib/server/web/lab-nav";
import { pageActor } from "@/lib/server/web/page-access";
import type { Role } from "@/lib/access/roles";

/**
 * Draws navigation. It also answers signed-out visitors (sign-in redirect) and non-members (404)
 * before any section's loading skeleton streams: once a skeleton is sent the HTTP status is fixed
 * at 200, so the page's own check could no longer make it a redirect or a 404. Each page still
 * checks access itself (pageLab); this only answers early.
 */
export default async function LabLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ labId: string }>;
}) {
  const { labId } = await params;
  const me = await getMe(await pageActor(`/labs/${labId}`));
  const lab = me.labs.find((l) => l.id === labId);
  if (!lab) notFound();
  return (
    <AppShell
      me={me}
      lab={{ id: lab.id, name: lab.name, role: lab.role as Role }}
      nav={labNav(lab.id, lab.role as Role)}
    >
      {children}
    </AppShell>
  );
}
