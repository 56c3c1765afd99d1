import type { Metadata } from "next";
import { AppShell } from "@/components/layout/app-shell";
import { PageHeader, Panel } from "@/components/ui/panel";
import { ROLE_LABELS, type Role } from "@/lib/access/roles";
import { getMe } from "@/lib/server/accounts/accounts";
import { listOwnAccountEvents } from "@/lib/server/audit";
import { pageActor } from "@/lib/server/web/page-access";
import Link from "next/link";
import { AccountEventsList } from "./account-events-list";
import { CreateLabForm } from "./create-lab-form";
import { EmailForm } from "./email-form";
import { NameForm } from "./name-form";
import { PasswordForm } from "./password-form";
import { SettingsForm } from "./settings-form";
import { TokensView } from "./tokens-view";

export const metadata: Metadata = { title: "Account" };
export const dynamic = "force-dynamic";

export default async function AccountPage() {
  const actor = await pageActor("/account");
  const [me, events] = await Promise.all([getMe(actor), listOwnAccountEvents(actor.userId, 20)]);
  return (
    <AppShell me={me}>
      <PageHeader title="Your account" subtitle={<span className="num">{me.email}</span>} />
      <div className="grid gap-6 lg:grid-cols-2">
        <Panel title="Your labs">
          <ul className="mb-4 space-y-1 text-sm" data-testid="my-labs">
            {me.labs.map((l) => (
              <li key={l.id} className="flex justify-between">
                <Link href={`/labs/${l.id}`} className="text-moss hover:underline">
                  {l.name}
                </Link>
                <span className="text-ink-soft">{ROLE_LABELS[l.role as Role]}</span>
              </li>
            ))}
          </ul>
          <CreateLabForm />
        </Panel>
        <Panel title="Name and e-mail">
          <div className="space-y-6">
            <NameForm name={me.name} />
            <EmailForm email={me.email} />
          </div>
        </Panel>
        <Panel title="Notifications">
          <SettingsForm notifyByEmail={me.notifyByEmail} />
        </Panel>
        <Panel title="Change password">
          <PasswordForm />
        </Panel>
      </div>
      <div className="mt-6">
        <Panel title="API tokens">
          <TokensView />
        </Panel>
      </div>
      <div className="mt-6">
        <Panel title="Recent sign-ins, account changes and API tokens">
          <p className="mb-3 text-sm text-ink-soft">
            The last 20, newest first. The managers of your labs see these too. If you see a sign-in that was not you,
            change your password and revoke your tokens.
          </p>
          <AccountEventsList items={events} empty="Nothing recorded yet." testId="account-events" />
        </Panel>
      </div>
    </AppShell>
  );
}
