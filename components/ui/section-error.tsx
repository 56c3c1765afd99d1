"use client";

import { useEffect } from "react";
import { useSWRConfig } from "swr";
import { Button } from "./button";

/**
 * What a section's error.tsx shows when its page could not be drawn: plain words, the error's
 * reference (digest) so a lab manager can find it in the server log, and "Try again". Never the
 * message or stack: in production those stay in the server log, where they belong.
 */
export function SectionError({
  what,
  error,
  retry,
}: {
  /** The thing that failed to load, in the user's words: "this fit", "the lab's studies". */
  what: string;
  error: unknown;
  retry: () => void;
}) {
  const { mutate } = useSWRConfig();
  useEffect(() => {
    console.error(error);
  }, [error]);
  // Try again means every read on the page: the server part is fetched anew by retry(), and the
  // browser's cached API answers are dropped first, or a bad cached answer would fail again at once.
  // Dropping them with revalidation also forgets the failed request, so the remounted table asks
  // the server again instead of waiting on that request's answer.
  async function tryAgain() {
    await mutate(() => true, undefined);
    retry();
  }
  const digest =
    error && typeof error === "object" && "digest" in error && typeof error.digest === "string" ? error.digest : null;
  return (
    <div
      role="alert"
      className="mx-auto max-w-lg rounded-lg border border-brick/40 bg-card p-6"
      data-testid="error-boundary"
    >
      <h1 className="text-lg font-semibold text-ink">We could not load {what}.</h1>
      <p className="mt-2 text-sm text-ink-soft">
        Something went wrong on our side or on the way to it; nothing you entered was lost or changed. Try again in a
        moment. If it keeps happening, tell your lab manager
        {digest ? (
          <>
            {" "}
            and quote the reference <span className="num text-ink">{digest}</span>
          </>
        ) : null}
        .
      </p>
      <div className="mt-4">
        <Button onClick={() => void tryAgain()} data-testid="error-retry">
          Try again
        </Button>
      </div>
    </div>
  );
}
