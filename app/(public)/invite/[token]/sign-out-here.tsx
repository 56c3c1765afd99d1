"use client";
import { signOut } from "next-auth/react";
import { Button } from "@/components/ui/button";

/** Signs out and comes back to this invitation, so the invitee can accept it. */
export function SignOutHere({ path }: { path: string }) {
  return (
    <Button
      type="button"
      variant="secondary"
      data-testid="invite-sign-out"
      onClick={() => signOut({ callbackUrl: path })}
    >
      Sign out
    </Button>
  );
}
