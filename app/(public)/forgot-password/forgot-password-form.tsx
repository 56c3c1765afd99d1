"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";
import { passwordResetRequestSchema } from "@/lib/contracts/account";

type Values = z.input<typeof passwordResetRequestSchema>;

export function ForgotPasswordForm({ catcherUrl }: { catcherUrl: string | null }) {
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(passwordResetRequestSchema) });

  async function onSubmit(values: Values) {
    setMessage(null);
    try {
      const answer = await sendJson<{ message: string }>("POST", "/api/v1/password-reset", values);
      setMessage({ tone: "success", text: answer.message });
    } catch (err) {
      setMessage({
        tone: "error",
        text: err instanceof ApiError ? capitalise(err.message) : "Could not send the link.",
      });
    }
  }

  return (
    <form
      onSubmit={form.handleSubmit(onSubmit)}
      className="space-y-4 rounded-lg border border-rule bg-card p-5"
      noValidate
      data-testid="forgot-password-form"
    >
      {message && (
        <Notice tone={message.tone} testId="forgot-password-message">
          {message.text}
          {message.tone === "success" && catcherUrl && (
            <span className="mt-1 block text-xs">
              This is a local development setup: read the mail at{" "}
              <a href={catcherUrl} className="break-all underline">
                {catcherUrl}
              </a>
              .
            </span>
          )}
        </Notice>
      )}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        {...form.register("email")}
        error={form.formState.errors.email?.message}
      />
      <Button type="submit" className="w-full" disabled={form.formState.isSubmitting} data-testid="send-reset-link">
        {form.formState.isSubmitting ? "Sending…" : "E-mail me a link to reset my password"}
      </Button>
    </form>
  );
}

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
