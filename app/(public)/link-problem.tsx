import Link from "next/link";
import { Notice } from "@/components/ui/notice";

/** The page behind an e-mailed link that no longer works: why, and where to ask again. */
export function LinkProblem({
  message,
  againHref,
  againLabel,
}: {
  message: string;
  againHref: string;
  againLabel: string;
}) {
  return (
    <div className="mx-auto max-w-md space-y-4 py-10">
      <h1 className="text-2xl font-semibold">This link does not work</h1>
      <Notice tone="error" testId="link-problem">
        {message.charAt(0).toUpperCase() + message.slice(1)}.
      </Notice>
      <p className="text-sm">
        <Link href={againHref} className="font-medium text-moss hover:underline" data-testid="ask-again">
          {againLabel}
        </Link>{" "}
        <span className="text-ink-soft">or</span>{" "}
        <Link href="/login" className="font-medium text-moss hover:underline">
          sign in
        </Link>
        .
      </p>
    </div>
  );
}
