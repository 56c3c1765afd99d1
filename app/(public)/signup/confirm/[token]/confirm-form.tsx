"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";

const schema = z.object({ password: z.string().min(1, "enter the password you chose when you signed up") });
type Values = z.input<typeof schema>;

export function ConfirmForm({ token, email }: { token: string; email: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const form = useForm<Values>({ resolver: zodResolver(schema) });

  async function onSubmit(values: Values) {
    setError(null);
    try {
      const { labId } = await sendJson<{ labId: string }>("POST", "/api/v1/signup/confirm", {
        token,
        password: values.password,
      });
      const res = await signIn("credentials", { email, password: values.password, redirect: false });
      if (res?.error) throw new Error("Your account is ready, but signing in failed; sign in from the sign-in page.");
      router.push(`/labs/${labId}`);
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError || err instanceof Error ? err.message : "Could not create the account.");
    }
  }

  return (
    <form
      onSubmit={form.handleSubmit(onSubmit)}
      className="space-y-4 rounded-lg border border-rule bg-card p-5"
      noValidate
    >
      {error && (
        <Notice tone="error" testId="confirm-error">
          {error}
        </Notice>
      )}
      <TextField
        label="Your password"
        type="password"
        autoComplete="current-password"
        hint="The one you chose when you signed up."
        {...form.register("password")}
        error={form.formState.errors.password?.message}
      />
      <Button type="submit" className="w-full" disabled={form.formState.isSubmitting} data-testid="confirm-account">
        {form.formState.isSubmitting ? "Creating…" : "Create my account and lab"}
      </Button>
    </form>
  );
}
