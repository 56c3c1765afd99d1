"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";
import { PASSWORD_MIN, signupSchema, type SignupInput } from "@/lib/contracts/account";

export function SignupForm() {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const form = useForm<SignupInput>({ resolver: zodResolver(signupSchema) });
  const e = form.formState.errors;

  async function onSubmit(values: SignupInput) {
    setError(null);
    try {
      const { email } = await sendJson<{ email: string }>("POST", "/api/v1/signup", values);
      router.push(`/signup/check-email?email=${encodeURIComponent(email)}`);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not create the account.");
    }
  }

  return (
    <form
      onSubmit={form.handleSubmit(onSubmit)}
      className="space-y-4 rounded-lg border border-rule bg-card p-5"
      noValidate
    >
      {error && (
        <Notice tone="error" testId="signup-error">
          {error}
        </Notice>
      )}
      <TextField label="Your name" autoComplete="name" {...form.register("name")} error={e.name?.message} />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        {...form.register("email")}
        error={e.email?.message}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters.`}
        {...form.register("password")}
        error={e.password?.message}
      />
      <TextField
        label="Lab name"
        placeholder="e.g. Skin Patterning Group"
        {...form.register("labName")}
        error={e.labName?.message}
      />
      <Button type="submit" className="w-full" disabled={form.formState.isSubmitting} data-testid="create-account">
        {form.formState.isSubmitting ? "Creating…" : "Create account and lab"}
      </Button>
    </form>
  );
}
