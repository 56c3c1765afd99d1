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
import { acceptInvitationSchema, PASSWORD_MIN, passwordSchema } from "@/lib/contracts/account";

type Values = z.input<typeof acceptInvitationSchema>;

export function AcceptForm({
  token,
  email,
  accountExists,
  signedInAsInvitee,
}: {
  token: string;
  email: string;
  accountExists: boolean;
  signedInAsInvitee: boolean;
}) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const schema = signedInAsInvitee
    ? acceptInvitationSchema
    : accountExists
      ? acceptInvitationSchema.extend({ password: z.string().min(1, "enter your password") })
      : acceptInvitationSchema.extend({
          name: z.string().trim().min(1, "enter your name").max(120),
          password: passwordSchema,
        });
  const form = useForm<Values>({ resolver: zodResolver(schema) });

  async function onSubmit(values: Values) {
    setError(null);
    try {
      const { labId } = await sendJson<{ labId: string }>(
        "POST",
        `/api/v1/invitations/${encodeURIComponent(token)}/accept`,
        values,
      );
      if (!signedInAsInvitee) {
        const res = await signIn("credentials", { email, password: values.password, redirect: false });
        if (res?.error) throw new Error("Joined the lab, but signing in failed; sign in from the sign-in page.");
      }
      router.push(`/labs/${labId}`);
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError || err instanceof Error ? err.message : "Could not accept the invitation.");
    }
  }

  return (
    <form
      onSubmit={form.handleSubmit(onSubmit)}
      className="space-y-4 rounded-lg border border-rule bg-card p-5"
      noValidate
    >
      {error && (
        <Notice tone="error" testId="accept-error">
          {error}
        </Notice>
      )}
      {signedInAsInvitee ? (
        <p className="text-sm text-ink-soft">You are signed in as {email}.</p>
      ) : accountExists ? (
        <p className="text-sm text-ink-soft">
          You already have a Morphokin account. Confirm with its password to join this lab.
        </p>
      ) : (
        <TextField
          label="Your name"
          autoComplete="name"
          {...form.register("name")}
          error={form.formState.errors.name?.message}
        />
      )}
      {!signedInAsInvitee && (
        <TextField
          label={accountExists ? "Your password" : "Choose a password"}
          type="password"
          autoComplete={accountExists ? "current-password" : "new-password"}
          hint={accountExists ? undefined : `At least ${PASSWORD_MIN} characters.`}
          {...form.register("password")}
          error={form.formState.errors.password?.message}
        />
      )}
      <Button type="submit" className="w-full" disabled={form.formState.isSubmitting} data-testid="accept-invitation">
        Join the lab
      </Button>
    </form>
  );
}
