"use client";
import { useEffect, useRef } from "react";
import { Button } from "@/components/ui/button";
import { ROLE_LABELS, ROLE_MAY_DO, type Role } from "@/lib/access/roles";

export interface RoleChange {
  memberId: string;
  email: string;
  from: Role;
  to: Role;
}

/**
 * Asks before a role changes, saying what the new role may do. A modal <dialog>: focus moves into
 * it, Escape cancels, and the page behind cannot be used until it closes.
 */
export function RoleChangeDialog({
  change,
  onConfirm,
  onCancel,
}: {
  change: RoleChange;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current;
    if (d && !d.open) d.showModal();
    return () => d?.close();
  }, []);
  const to = ROLE_LABELS[change.to];
  return (
    <dialog
      ref={ref}
      aria-labelledby="role-change-title"
      data-testid="role-change-dialog"
      onCancel={(e) => {
        e.preventDefault();
        onCancel();
      }}
      className="m-auto w-full max-w-md rounded-lg border border-rule bg-card p-5 text-ink shadow-lg backdrop:bg-ink/30"
    >
      <h2 id="role-change-title" className="mb-3 text-lg font-semibold">
        Make {change.email} {withArticle(to)}?
      </h2>
      <p className="mb-2 text-sm">
        Now {ROLE_LABELS[change.from]}. As {to} they may: <strong>{ROLE_MAY_DO[change.to]}</strong>.
      </p>
      <p className="mb-4 text-sm text-ink-soft">The change applies at once and is recorded in the audit trail.</p>
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onCancel} data-testid="role-change-cancel">
          Cancel
        </Button>
        <Button onClick={onConfirm} data-testid="role-change-confirm">
          Change to {to}
        </Button>
      </div>
    </dialog>
  );
}

const withArticle = (label: string) => `${/^[AEIOU]/i.test(label) ? "an" : "a"} ${label}`;
