import { AppShell } from "@/components/layout/app-shell";
import { getActor } from "@/lib/server/accounts/actor";
import { getMe } from "@/lib/server/accounts/accounts";
import { labNav } from "@/lib/server/web/lab-nav";
import type { Role } from "@/lib/access/roles";

/** Draws navigation only; each page checks access itself. */
export default async function LabLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ labId: string }>;
}) {
  const { labId } = await params;
  const actor = await getActor();
  if (!actor) return <>{children}</>;
  const me = await getMe(actor);
  const lab = me.labs.find((l) => l.id === labId);
  return (
    <AppShell
      me={me}
      lab={lab ? { id: lab.id, name: lab.name, role: lab.role as Role } : undefined}
      nav={lab ? labNav(lab.id, lab.role as Role) : []}
    >
      {children}
    </AppShell>
  );
}
