import type { Metadata } from "next";
import Link from "next/link";
import { localMailCatcherUrl } from "@/lib/server/labs/mailbox";
import { ForgotPasswordForm } from "./forgot-password-form";

export const metadata: Metadata = { title: "Forgot your password?" };
export const dynamic = "force-dynamic";

/** Asks for the address; the answer is the same whether or not it has an account. */
export default function ForgotPasswordPage() {
  return (
    <div className="mx-auto max-w-md space-y-5 py-6">
      <h1 className="text-2xl font-semibold">Forgot your password?</h1>
      <p className="text-sm text-ink-soft">
        Type the e-mail address of your account. We send a link to choose a new password; it works once, for a limited
        time, and signs you out everywhere.
      </p>
      <ForgotPasswordForm catcherUrl={localMailCatcherUrl()} />
      <p className="text-center text-sm">
        <Link href="/login" className="font-medium text-moss hover:underline">
          Back to sign-in
        </Link>
      </p>
    </div>
  );
}
