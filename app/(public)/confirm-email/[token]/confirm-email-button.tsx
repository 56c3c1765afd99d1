"use client";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";

export function ConfirmEmailButton({ token, newEmail }: { token: string; newEmail: string }) {
  const [state, setState] = useState<"idle" | "busy" | "done">("idle");
  const [error, setError] = useState<string | null>(null);

  async function confirm() {
    setState("busy");
    setError(null);
    try {
      await sendJson("POST", "/api/v1/email-change/confirm", { token });
      setState("done");
    } catch (err) {
      const text = err instanceof ApiError ? err.message : "could not change the address";
      setError(text.charAt(0).toUpperCase() + text.slice(1) + ".");
      setState("idle");
    }
  }

  if (state === "done")
    return (
      <Notice tone="success" testId="email-confirmed">
        Done: your address is now <span className="num">{newEmail}</span>.{" "}
        <Link href="/account" className="underline">
          Go to your account
        </Link>
      </Notice>
    );
  return (
    <div className="space-y-3">
      {error && (
        <Notice tone="error" testId="email-confirm-error">
          {error}
        </Notice>
      )}
      <Button onClick={confirm} disabled={state === "busy"} data-testid="confirm-email">
        {state === "busy" ? "Confirming…" : `Use ${newEmail}`}
      </Button>
    </div>
  );
}
