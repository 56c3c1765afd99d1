"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";
import { changePasswordSchema, PASSWORD_MIN } from "@/lib/contracts/account";

type Values = z.input<typeof changePasswordSchema>;

/** Current + new password; the server ends every other session of the account. */
export function PasswordForm() {
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(changePasswordSchema) });
  const e = form.formState.errors;

  async function onSubmit(values: Values) {
    setMessage(null);
    try {
      const { endedSessions } = await sendJson<{ endedSessions: number }>("POST", "/api/v1/me/password", values);
      form.reset();
      setMessage({
        tone: "success",
        text: `Password changed.${endedSessions ? ` Signed out ${endedSessions === 1 ? "1 other session" : `${endedSessions} other sessions`}.` : ""}`,
      });
    } catch (err) {
      setMessage({ tone: "error", text: err instanceof ApiError ? err.message : "Could not change the password." });
    }
  }

  return (
    <form onSubmit={form.handleSubmit(onSubmit)} className="space-y-3" noValidate data-testid="password-form">
      {message && (
        <Notice tone={message.tone} testId="password-message">
          {message.text}
        </Notice>
      )}
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        {...form.register("currentPassword")}
        error={e.currentPassword?.message}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters. Your other sessions are signed out.`}
        {...form.register("newPassword")}
        error={e.newPassword?.message}
      />
      <Button type="submit" disabled={form.formState.isSubmitting} data-testid="change-password">
        {form.formState.isSubmitting ? "Changing…" : "Change password"}
      </Button>
    </form>
  );
}
