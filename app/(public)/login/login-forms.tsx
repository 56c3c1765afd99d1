"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { loginSchema, magicLinkSchema } from "@/lib/contracts/account";

const ERRORS: Record<string, string> = {
  CredentialsSignin: "Wrong e-mail or password.",
  Verification: "That sign-in link has expired or was already used. Ask for a new one below.",
  AccessDenied: "That account may not sign in.",
  SessionRequired: "Sign in to open that page.",
};

/** "Locked:14" / "RateLimited:3" (lib/server/accounts/auth-limits.ts) → a sentence with the minutes; else a known code. */
function describeError(code: string): string {
  const [kind, minutes] = code.split(":");
  const wait = minutes === "1" ? "1 minute" : `${minutes} minutes`;
  if (kind === "Locked" && minutes)
    return `Too many failed sign-ins for this account; try again in ${wait} or use a sign-in link.`;
  if (kind === "RateLimited" && minutes) return `Too many attempts from here; try again in ${wait}.`;
  return ERRORS[code] ?? "Sign-in failed; try again.";
}

export function LoginForms() {
  const router = useRouter();
  const params = useSearchParams();
  const callbackUrl = params.get("callbackUrl") ?? "/labs";
  const [error, setError] = useState<string | null>(params.get("error") ? describeError(params.get("error")!) : null);
  const pw = useForm<z.input<typeof loginSchema>>({ resolver: zodResolver(loginSchema) });
  const link = useForm<z.input<typeof magicLinkSchema>>({ resolver: zodResolver(magicLinkSchema) });

  async function onPassword(values: z.input<typeof loginSchema>) {
    setError(null);
    const res = await signIn("credentials", { email: values.email, password: values.password, redirect: false });
    if (!res || res.error) {
      setError(res?.error && res.error !== "CredentialsSignin" ? describeError(res.error) : ERRORS.CredentialsSignin);
      return;
    }
    router.push(callbackUrl);
    router.refresh();
  }

  async function onLink(values: z.input<typeof magicLinkSchema>) {
    setError(null);
    await signIn("email", { email: values.email, callbackUrl });
  }

  return (
    <div className="space-y-6">
      {params.get("reset") === "1" && !error && (
        <Notice tone="success" testId="password-was-reset">
          Your new password is set and every session was signed out. Sign in with the new password.
        </Notice>
      )}
      {error && (
        <Notice tone="error" testId="login-error">
          {error}
        </Notice>
      )}
      <form
        onSubmit={pw.handleSubmit(onPassword)}
        className="space-y-4 rounded-lg border border-rule bg-card p-5"
        noValidate
      >
        <TextField
          label="E-mail"
          type="email"
          autoComplete="email"
          {...pw.register("email")}
          error={pw.formState.errors.email?.message}
        />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          {...pw.register("password")}
          error={pw.formState.errors.password?.message}
        />
        <Button type="submit" disabled={pw.formState.isSubmitting} className="w-full" data-testid="sign-in">
          {pw.formState.isSubmitting ? "Signing in…" : "Sign in"}
        </Button>
        <p className="text-right text-sm">
          <Link href="/forgot-password" className="text-moss hover:underline" data-testid="forgot-password">
            Forgot your password?
          </Link>
        </p>
      </form>
      <form
        onSubmit={link.handleSubmit(onLink)}
        className="space-y-3 rounded-lg border border-rule bg-card p-5"
        noValidate
      >
        <p className="text-sm text-ink-soft">Or get a one-time sign-in link by e-mail.</p>
        <TextField
          label="E-mail for the link"
          type="email"
          {...link.register("email")}
          name="linkEmail"
          error={link.formState.errors.email?.message}
          onChange={(e) => link.setValue("email", e.target.value)}
        />
        <Button
          type="submit"
          variant="secondary"
          disabled={link.formState.isSubmitting}
          className="w-full"
          data-testid="send-link"
        >
          E-mail me a sign-in link
        </Button>
      </form>
      <p className="text-center text-sm text-ink-soft">
        New to Morphokin?{" "}
        <Link href="/signup" className="font-medium text-moss hover:underline">
          Create an account and a lab
        </Link>
      </p>
    </div>
  );
}
