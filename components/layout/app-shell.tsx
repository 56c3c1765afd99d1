import Link from "next/link";
import { ROLE_LABELS, type Role } from "@/lib/access/roles";
import { ResearchCaution } from "./footer";
import { LabNav } from "./lab-nav";
import { LabSearch } from "./lab-search";
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
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-4 gap-y-2 px-6 py-3">
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
          {lab && (
            // Its own line below 768 px (last, full width); beside the account link from there up.
            <LabSearch labId={lab.id} className="order-last w-full md:order-none md:ml-auto md:w-64" />
          )}
          <div className={`${lab ? "ml-auto md:ml-0" : "ml-auto"} flex items-center gap-4`}>
            <Link
              href="/account"
              className="max-w-60 truncate text-sm text-ink-soft hover:text-ink"
              title={me.name ?? me.email}
              data-testid="account-link"
            >
              {me.name ?? me.email}
            </Link>
            <SignOutButton />
          </div>
        </div>
        <LabNav items={nav} />
      </header>
      <main className="mx-auto w-full max-w-7xl flex-1 px-6 py-8">{children}</main>
      <ResearchCaution />
    </div>
  );
}
