"use client";
import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button
      type="button"
      data-testid="sign-out"
      onClick={() => signOut({ callbackUrl: "/login" })}
      className="text-sm text-ink-soft hover:text-ink"
    >
      Sign out
    </button>
  );
}
