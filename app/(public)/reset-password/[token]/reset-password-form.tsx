"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";
import { PASSWORD_MIN, passwordSchema } from "@/lib/contracts/account";

const schema = z
  .object({ newPassword: passwordSchema, repeat: z.string() })
  .refine((v) => v.newPassword === v.repeat, { path: ["repeat"], message: "the two passwords differ" });
type Values = z.input<typeof schema>;

export function ResetPasswordForm({ token }: { token: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(schema) });
  const e = form.formState.errors;

  async function onSubmit(values: Values) {
    setError(null);
    try {
      await sendJson("POST", "/api/v1/password-reset/confirm", { token, newPassword: values.newPassword });
      router.push("/login?reset=1");
    } catch (err) {
      const text = err instanceof ApiError ? err.message : "could not set the password";
      setError(text.charAt(0).toUpperCase() + text.slice(1) + ".");
    }
  }

  return (
    <form
      onSubmit={form.handleSubmit(onSubmit)}
      className="space-y-4 rounded-lg border border-rule bg-card p-5"
      noValidate
      data-testid="reset-password-form"
    >
      {error && (
        <Notice tone="error" testId="reset-password-error">
          {error}{" "}
          <Link href="/forgot-password" className="underline">
            Ask for a new link
          </Link>
        </Notice>
      )}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters.`}
        {...form.register("newPassword")}
        error={e.newPassword?.message}
      />
      <TextField
        label="New password again"
        type="password"
        autoComplete="new-password"
        {...form.register("repeat")}
        error={e.repeat?.message}
      />
      <Button type="submit" className="w-full" disabled={form.formState.isSubmitting} data-testid="set-new-password">
        {form.formState.isSubmitting ? "Saving…" : "Set the new password"}
      </Button>
    </form>
  );
}
