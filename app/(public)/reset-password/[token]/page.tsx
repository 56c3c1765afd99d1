import type { Metadata } from "next";
import { describePasswordReset } from "@/lib/server/accounts/password-reset";
import { AppError } from "@/lib/server/errors";
import { LinkProblem } from "../../link-problem";
import { ResetPasswordForm } from "./reset-password-form";

export const metadata: Metadata = { title: "Choose a new password" };
export const dynamic = "force-dynamic";

/** Opening the link changes nothing (mail scanners open links); the form does. */
export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  let email: string;
  try {
    ({ email } = await describePasswordReset(token));
  } catch (err) {
    if (err instanceof AppError && (err.code === "not_found" || err.code === "conflict"))
      return (
        <LinkProblem
          message={err.message}
          againHref="/forgot-password"
          againLabel="Ask for a new password reset link"
        />
      );
    throw err;
  }
  return (
    <div className="mx-auto max-w-md space-y-5 py-6">
      <h1 className="text-2xl font-semibold">Choose a new password</h1>
      <p className="text-sm text-ink-soft">
        For <span className="num">{email}</span>. Every session of this account is signed out when you save it.
      </p>
      <ResetPasswordForm token={token} />
    </div>
  );
}
