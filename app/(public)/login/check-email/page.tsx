import Link from "next/link";

export default function CheckEmail() {
  return (
    <div className="mx-auto max-w-md space-y-4 py-10 text-center">
      <h1 className="text-2xl font-semibold">Check your e-mail</h1>
      <p className="text-ink-soft" data-testid="check-email">
        If that address has a Morphokin account, a sign-in link is on its way. The link works once and expires in 30
        minutes.
      </p>
      <Link href="/login" className="text-sm font-medium text-moss hover:underline">
        Back to sign-in
      </Link>
    </div>
  );
}
