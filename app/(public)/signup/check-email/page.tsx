import type { Metadata } from "next";
import Link from "next/link";
import { localMailCatcherUrl } from "@/lib/server/labs/mailbox";

export const metadata: Metadata = { title: "Check your e-mail" };
export const dynamic = "force-dynamic";

/**
 * After sign-up. The same page for every address (it must not tell whether one has an account).
 * In a local development setup, mail stays in the local mail catcher, so the page says where to
 * read it: the catcher's own listing on loopback, which anyone on this machine can read anyway;
 * the page itself shows no mail.
 */
export default async function SignupCheckEmail({ searchParams }: { searchParams: Promise<{ email?: string }> }) {
  const { email } = await searchParams;
  const catcher = localMailCatcherUrl(email);
  return (
    <div className="mx-auto max-w-md space-y-4 py-10 text-center">
      <h1 className="text-2xl font-semibold">Check your e-mail</h1>
      <p className="text-ink-soft" data-testid="signup-check-email">
        We sent a message to {email ? <span className="num">{email}</span> : "your address"}. Open the link in it to
        finish creating your account and lab.
      </p>
      {catcher && (
        <p className="text-sm text-ink-soft" data-testid="local-mail-catcher">
          This is a local development setup: mail is not sent out but kept by the local mail catcher. Read it at{" "}
          <a href={catcher} className="break-all text-moss underline">
            {catcher}
          </a>
          .
        </p>
      )}
      <Link href="/login" className="text-sm font-medium text-moss hover:underline">
        Back to sign-in
      </Link>
    </div>
  );
}
