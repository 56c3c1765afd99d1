"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";
import { emailChangeSchema } from "@/lib/contracts/account";

type Values = z.input<typeof emailChangeSchema>;

/** A new address takes effect when the link mailed to it is opened; the current one gets a notice. */
export function EmailForm({ email }: { email: string }) {
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(emailChangeSchema) });
  const e = form.formState.errors;

  async function onSubmit(values: Values) {
    setMessage(null);
    try {
      const answer = await sendJson<{ message: string }>("POST", "/api/v1/me/email", values);
      form.reset();
      setMessage({ tone: "success", text: answer.message });
    } catch (err) {
      setMessage({ tone: "error", text: err instanceof ApiError ? err.message : "Could not change the address." });
    }
  }

  return (
    <form onSubmit={form.handleSubmit(onSubmit)} className="space-y-3" noValidate data-testid="email-form">
      {message && (
        <Notice tone={message.tone} testId="email-message">
          {message.text}
        </Notice>
      )}
      <TextField
        label="New e-mail address"
        type="email"
        autoComplete="email"
        hint={`Now ${email}. We send a link to the new address; it stays ${email} until you open it.`}
        {...form.register("newEmail")}
        error={e.newEmail?.message}
      />
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        {...form.register("currentPassword")}
        name="emailCurrentPassword"
        onChange={(ev) => form.setValue("currentPassword", ev.target.value)}
        error={e.currentPassword?.message}
      />
      <Button type="submit" variant="secondary" disabled={form.formState.isSubmitting} data-testid="change-email">
        {form.formState.isSubmitting ? "Sending…" : "Send the link to the new address"}
      </Button>
    </form>
  );
}
