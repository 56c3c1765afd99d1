"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";

/** The display name others see (members list, comments, audit trail). */
export function NameForm({ name }: { name: string | null }) {
  const router = useRouter();
  const [value, setValue] = useState(name ?? "");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setMessage(null);
    if (!value.trim()) {
      setMessage({ tone: "error", text: "Display name: enter the name others should see." });
      return;
    }
    setBusy(true);
    try {
      const me = await sendJson<{ name: string }>("PATCH", "/api/v1/me", { name: value });
      setValue(me.name);
      setMessage({ tone: "success", text: "Display name saved." });
      router.refresh();
    } catch (err) {
      setMessage({ tone: "error", text: err instanceof ApiError ? err.message : "Could not save the name." });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={save} className="space-y-3" noValidate data-testid="name-form">
      {message && (
        <Notice tone={message.tone} testId="name-message">
          {message.text}
        </Notice>
      )}
      <TextField
        label="Display name"
        name="displayName"
        autoComplete="name"
        maxLength={120}
        value={value}
        onChange={(e) => setValue(e.target.value)}
      />
      <Button type="submit" variant="secondary" disabled={busy} data-testid="save-name">
        {busy ? "Saving…" : "Save name"}
      </Button>
    </form>
  );
}
