import type { Metadata } from "next";
import { describeEmailChange } from "@/lib/server/accounts/profile";
import { AppError } from "@/lib/server/errors";
import { LinkProblem } from "../../link-problem";
import { ConfirmEmailButton } from "./confirm-email-button";

export const metadata: Metadata = { title: "Confirm your new e-mail address" };
export const dynamic = "force-dynamic";

/** Opening the link changes nothing (mail scanners open links); the button does. */
export default async function ConfirmEmailPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  let newEmail: string;
  try {
    ({ newEmail } = await describeEmailChange(token));
  } catch (err) {
    if (err instanceof AppError && (err.code === "not_found" || err.code === "conflict"))
      return (
        <LinkProblem message={err.message} againHref="/account" againLabel="Change the address on your Account page" />
      );
    throw err;
  }
  return (
    <div className="mx-auto max-w-md space-y-5 py-6">
      <h1 className="text-2xl font-semibold">Confirm your new e-mail address</h1>
      <p className="text-sm text-ink-soft">
        Your Morphokin account will use <span className="num text-ink">{newEmail}</span> from now on: to sign in, for
        links and for notifications.
      </p>
      <ConfirmEmailButton token={token} newEmail={newEmail} />
    </div>
  );
}
