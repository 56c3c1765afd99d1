import type { Metadata } from "next";
import { getActor } from "@/lib/server/accounts/actor";
import { describeInvitation, wrongAccountMessage } from "@/lib/server/labs/invitations";
import { AppError } from "@/lib/server/errors";
import { Notice } from "@/components/ui/notice";
import { AcceptForm } from "./accept-form";
import { SignOutHere } from "./sign-out-here";

export const metadata: Metadata = { title: "Invitation" };
export const dynamic = "force-dynamic";

const UNUSABLE = {
  accepted: "This invitation was already used. Sign in with your e-mail and password instead.",
  revoked: "This invitation was revoked by the lab manager. Ask them for a new one.",
  expired: "This invitation has expired. Ask the lab manager for a new one.",
} as const;

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  let inv;
  try {
    inv = await describeInvitation(token);
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found") {
      return (
        <div className="mx-auto max-w-md py-10">
          <Notice tone="error" testId="invite-error">
            This invitation link is not valid. Check that you copied the whole link from the e-mail.
          </Notice>
        </div>
      );
    }
    throw err;
  }
  const actor = await getActor();
  const otherAccount = actor && actor.email.toLowerCase() !== inv.email.toLowerCase() ? actor.email : null;
  return (
    <div className="mx-auto max-w-md space-y-5 py-6">
      <h1 className="text-2xl font-semibold">Join {inv.labName}</h1>
      <p className="text-sm text-ink-soft">
        You are invited as <strong className="text-ink">{inv.roleLabel}</strong> with the address{" "}
        <span className="num">{inv.email}</span>.
      </p>
      {inv.status === "pending" && otherAccount ? (
        <div className="space-y-3">
          <Notice tone="error" testId="invite-error">
            {wrongAccountMessage(otherAccount, inv.email)}
          </Notice>
          <SignOutHere path={`/invite/${encodeURIComponent(token)}`} />
        </div>
      ) : inv.status === "pending" ? (
        <AcceptForm token={token} email={inv.email} accountExists={inv.accountExists} signedInAsInvitee={!!actor} />
      ) : (
        <Notice tone="error" testId="invite-error">
          {UNUSABLE[inv.status]}
        </Notice>
      )}
    </div>
  );
}
