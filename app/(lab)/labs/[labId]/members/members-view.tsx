"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import type { ColumnDef } from "@tanstack/react-table";
import { useState } from "react";
import { useForm } from "react-hook-form";
import useSWR from "swr";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { SelectField, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Badge, EmptyState, Panel } from "@/components/ui/panel";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/access/roles";
import { ApiError, fetchJson, sendJson } from "@/lib/client/api";
import { formatDate, formatDateTime } from "@/lib/client/format";
import { invitationCreateSchema } from "@/lib/contracts/lab";
import type { InvitationDto } from "@/lib/server/labs/invitations";
import type { MemberDto } from "@/lib/server/labs/members";
import { RoleChangeDialog, type RoleChange } from "./role-change-dialog";

const roleOptions = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

export function MembersView({ labId, canManage, myUserId }: { labId: string; canManage: boolean; myUserId: string }) {
  const [refresh, setRefresh] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState<RoleChange | null>(null);
  const act = async (fn: () => Promise<unknown>) => {
    setError(null);
    try {
      await fn();
      setRefresh((r) => r + 1);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "That did not work.");
      setRefresh((r) => r + 1);
    }
  };
  const columns: ColumnDef<MemberDto, unknown>[] = [
    {
      id: "email",
      header: "E-mail",
      cell: ({ row }) => (
        <span className="num">
          {row.original.email}
          {row.original.userId === myUserId && <span className="ml-2 text-xs text-ink-soft">(you)</span>}
        </span>
      ),
    },
    { id: "name", header: "Name", cell: ({ row }) => row.original.name ?? "—" },
    {
      id: "role",
      header: "Role",
      cell: ({ row }) =>
        canManage ? (
          <select
            aria-label={`Role of ${row.original.email}`}
            data-testid={`role-${row.original.email}`}
            value={row.original.role}
            onChange={(e) =>
              // Not sent yet: the dialog says what the new role may do and asks first.
              setPending({
                memberId: row.original.id,
                email: row.original.email,
                from: row.original.role,
                to: e.target.value as Role,
              })
            }
            className="rounded border border-rule bg-card px-2 py-1 text-sm"
          >
            {roleOptions.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        ) : (
          <Badge tone={row.original.role === "manager" ? "moss" : "plain"}>{ROLE_LABELS[row.original.role]}</Badge>
        ),
    },
    {
      id: "joinedAt",
      header: "Joined",
      cell: ({ row }) => <span className="num text-ink-soft">{formatDate(row.original.joinedAt)}</span>,
    },
    ...(canManage
      ? [
          {
            id: "actions",
            header: "",
            enableSorting: false,
            cell: ({ row }: { row: { original: MemberDto } }) => (
              <Button
                size="sm"
                variant="danger"
                data-testid={`remove-${row.original.email}`}
                onClick={() =>
                  confirm(`Remove ${row.original.email} from the lab?`) &&
                  act(() => sendJson("DELETE", `/api/v1/labs/${labId}/members/${row.original.id}`))
                }
              >
                Remove
              </Button>
            ),
          } as ColumnDef<MemberDto, unknown>,
        ]
      : []),
  ];
  return (
    <div className="space-y-6">
      {error && (
        <Notice tone="error" testId="members-error">
          {error}
        </Notice>
      )}
      <DataTable<MemberDto>
        url={`/api/v1/labs/${labId}/members`}
        columns={columns}
        defaultSort={{ id: "email", desc: false }}
        filterPlaceholder="Filter by e-mail, name, role…"
        testId="members-table"
        refreshKey={refresh}
        empty={<EmptyState title="No members." />}
      />
      {canManage && <Invitations labId={labId} onChange={() => setRefresh((r) => r + 1)} />}
      {pending && (
        <RoleChangeDialog
          change={pending}
          onCancel={() => setPending(null)}
          onConfirm={() => {
            const { memberId, to } = pending;
            setPending(null);
            void act(() => sendJson("PATCH", `/api/v1/labs/${labId}/members/${memberId}`, { role: to }));
          }}
        />
      )}
    </div>
  );
}

type InviteValues = z.input<typeof invitationCreateSchema>;

function Invitations({ labId, onChange }: { labId: string; onChange: () => void }) {
  const { data, mutate } = useSWR<{ items: InvitationDto[] }>(`/api/v1/labs/${labId}/invitations`, fetchJson);
  const [message, setMessage] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const form = useForm<InviteValues>({
    resolver: zodResolver(invitationCreateSchema),
    defaultValues: { role: "scientist" },
  });
  async function invite(values: InviteValues) {
    setMessage(null);
    try {
      const inv = await sendJson<InvitationDto>("POST", `/api/v1/labs/${labId}/invitations`, values);
      setMessage({
        tone: "success",
        text: `Invitation e-mailed to ${inv.email} as ${ROLE_LABELS[inv.role]}; it expires ${formatDate(inv.expiresAt)}.`,
      });
      form.reset({ email: "", role: values.role });
      await mutate();
      onChange();
    } catch (err) {
      setMessage({ tone: "error", text: err instanceof ApiError ? err.message : "Could not send the invitation." });
    }
  }
  async function revoke(inv: InvitationDto) {
    try {
      await sendJson("DELETE", `/api/v1/labs/${labId}/invitations/${inv.id}`);
      await mutate();
    } catch (err) {
      setMessage({ tone: "error", text: err instanceof ApiError ? err.message : "Could not revoke." });
    }
  }
  const tone: Record<InvitationDto["status"], "moss" | "plain" | "ochre" | "brick"> = {
    pending: "ochre",
    accepted: "moss",
    revoked: "plain",
    expired: "brick",
  };
  return (
    <Panel title="Invitations">
      <form
        onSubmit={form.handleSubmit(invite)}
        className="mb-4 flex flex-wrap items-end gap-3"
        noValidate
        data-testid="invite-form"
      >
        <div className="w-72">
          <TextField
            label="E-mail"
            type="email"
            {...form.register("email")}
            error={form.formState.errors.email?.message}
          />
        </div>
        <div className="w-48">
          <SelectField
            label="Role"
            options={roleOptions}
            {...form.register("role")}
            error={form.formState.errors.role?.message}
          />
        </div>
        <Button type="submit" disabled={form.formState.isSubmitting} data-testid="send-invitation">
          Send invitation
        </Button>
      </form>
      {message && (
        <div className="mb-4">
          <Notice tone={message.tone} testId="invite-message">
            {message.text}
          </Notice>
        </div>
      )}
      {data && data.items.length === 0 ? (
        <p className="text-sm text-ink-soft">
          No invitations yet. Invite people by e-mail with the role they should have.
        </p>
      ) : (
        <table className="w-full text-left text-sm" data-testid="invitations-table">
          <thead className="text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="py-1">E-mail</th>
              <th>Role</th>
              <th>Status</th>
              <th>Sent</th>
              <th>Expires</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {data?.items.map((inv) => (
              <tr key={inv.id} className="border-t border-rule/60">
                <td className="num py-1.5">{inv.email}</td>
                <td>{ROLE_LABELS[inv.role as Role]}</td>
                <td>
                  <Badge tone={tone[inv.status]}>{inv.status}</Badge>
                </td>
                <td className="num text-ink-soft">{formatDateTime(inv.invitedAt)}</td>
                <td className="num text-ink-soft">{formatDate(inv.expiresAt)}</td>
                <td className="text-right">
                  {inv.status === "pending" && (
                    <Button size="sm" variant="ghost" onClick={() => revoke(inv)} data-testid={`revoke-${inv.email}`}>
                      Revoke
                    </Button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </Panel>
  );
}
