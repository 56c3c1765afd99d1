import Link from "next/link";
import { ROLE_LABELS, type Role } from "@/lib/access/roles";
import { ResearchCaution } from "./footer";
import { LabSwitcher } from "./lab-switcher";
import { Logo } from "./logo";
import { SignOutButton } from "./sign-out-button";

export interface ShellProps {
  me: { email: string; name: string | null; labs: { id: string; name: string; role: string }[] };
  lab?: { id: string; name: string; role: Role };
  nav?: { href: string; label: string }[];
  children: React.ReactNode;
}

export function AppShell({ me, lab, nav = [], children }: ShellProps) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-rule bg-card/70">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-4 px-6 py-3">
          <Link href={lab ? `/labs/${lab.id}` : "/labs"} className="flex items-center gap-2 font-semibold text-ink">
            <Logo />
            Morphokin
          </Link>
          <LabSwitcher labs={me.labs} currentId={lab?.id} />
          {lab && (
            <span className="text-xs text-ink-soft" data-testid="current-role">
              {ROLE_LABELS[lab.role]}
            </span>
          )}
          <nav className="flex flex-wrap items-center gap-1 text-sm" aria-label="Lab">
            {nav.map((n) => (
              <Link
                key={n.href}
                href={n.href}
                className="rounded px-2 py-1 text-ink-soft hover:bg-paper-deep hover:text-ink"
              >
                {n.label}
              </Link>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-4">
            <Link href="/account" className="text-sm text-ink-soft hover:text-ink" data-testid="account-link">
              {me.name ?? me.email}
            </Link>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-7xl flex-1 px-6 py-8">{children}</main>
      <ResearchCaution />
    </div>
  );
}
