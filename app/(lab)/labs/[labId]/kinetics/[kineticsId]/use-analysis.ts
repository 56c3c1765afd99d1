"use client";
/**
 * Debounced analysis calls: the body settles for `delayMs` before it is sent, SWR keeps the
 * previous result on screen while the next one computes, and `computing` drives the small indicator.
 */
import { useEffect, useState } from "react";
import useSWR from "swr";
import { ApiError, sendJson } from "@/lib/client/api";
import { typedNumberOrText } from "@/lib/format/typed-number";

function useDebounced<T>(value: T, delayMs: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), delayMs);
    return () => clearTimeout(t);
  }, [value, delayMs]);
  return v;
}

export function useAnalysis<T>(url: string, body: unknown, delayMs = 300) {
  const key = body === null ? null : JSON.stringify(body);
  const settled = useDebounced(key, delayMs);
  // Each result carries the inputs it was computed from, so a panel can tell when it no longer matches them.
  const swr = useSWR<{ result: T; body: string }, ApiError, [string, string] | null>(
    settled ? [url, settled] : null,
    async ([u, b]: [string, string]) => ({ result: await sendJson<T>("POST", u, JSON.parse(b)), body: b }),
    {
      keepPreviousData: true,
      revalidateOnFocus: false,
      revalidateIfStale: false,
      shouldRetryOnError: false,
    },
  );
  const computing = swr.isValidating || key !== settled;
  return {
    data: swr.data?.result,
    error: swr.error,
    computing,
    /** The result shown was computed from other inputs than the current ones (e.g. the last change failed). */
    stale: swr.data !== undefined && (swr.data.body !== key || swr.error !== undefined) && !computing,
  };
}

/** A number when the text is one ("0,65" too), otherwise the text (so the server's message names the field). */
export function numberOrText(s: string): number | string {
  return typedNumberOrText(s);
}
/** A number, or undefined when blank (optional fields). */
export function optionalNumber(s: string): number | string | undefined {
  return s.trim() === "" ? undefined : numberOrText(s);
}
