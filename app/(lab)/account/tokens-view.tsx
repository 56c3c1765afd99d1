"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import useSWR from "swr";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Badge } from "@/components/ui/panel";
import { ApiError, fetchJson, sendJson } from "@/lib/client/api";
import { formatDate, formatDateTime } from "@/lib/client/format";
import { DEFAULT_TOKEN_LIFETIME_DAYS, TOKEN_LIFETIMES_DAYS, tokenCreateSchema } from "@/lib/contracts/account";
import type { TokenDto } from "@/lib/server/accounts/tokens";

export function TokensView() {
  const { data, mutate } = useSWR<{ items: TokenDto[] }>("/api/v1/tokens", fetchJson);
  const [secret, setSecret] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const form = useForm<z.input<typeof tokenCreateSchema>>({
    resolver: zodResolver(tokenCreateSchema),
    defaultValues: { name: "", expiresInDays: DEFAULT_TOKEN_LIFETIME_DAYS },
  });
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        Scripts call the same JSON API with <code className="num">Authorization: Bearer &lt;token&gt;</code>. A token
        acts as you, in every lab you belong to, with your role there, until it expires or you revoke it.
      </p>
      <form
        noValidate
        className="flex items-end gap-2"
        onSubmit={form.handleSubmit(async (v) => {
          setError(null);
          try {
            const t = await sendJson<TokenDto & { secret: string }>("POST", "/api/v1/tokens", v);
            setSecret(t.secret);
            form.reset({ name: "", expiresInDays: DEFAULT_TOKEN_LIFETIME_DAYS });
            await mutate();
          } catch (err) {
            setError(err instanceof ApiError ? err.message : "Could not create the token.");
          }
        })}
      >
        <div className="w-72">
          <TextField
            label="Token name"
            placeholder="e.g. batch readouts on the lab server"
            {...form.register("name")}
            error={form.formState.errors.name?.message}
          />
        </div>
        <div className="w-40">
          <SelectField
            label="Expires after"
            options={TOKEN_LIFETIMES_DAYS.map((d) => ({ value: String(d), label: `${d} days` }))}
            {...form.register("expiresInDays", { valueAsNumber: true })}
            error={form.formState.errors.expiresInDays?.message}
          />
        </div>
        <Button type="submit" data-testid="create-token">
          Create token
        </Button>
      </form>
      {error && <Notice tone="error">{error}</Notice>}
      {secret && (
        <Notice tone="warning" testId="token-secret">
          Copy this token now; it is shown only once:{" "}
          <code className="num select-all break-all text-ink">{secret}</code>
        </Notice>
      )}
      <table className="w-full text-left text-sm" data-testid="tokens-table">
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th className="py-1">Name</th>
            <th>Starts with</th>
            <th>Created</th>
            <th>Last used</th>
            <th>Expires</th>
            <th>Status</th>
            <th />
          </tr>
        </thead>
        <tbody>
          {data?.items.map((t) => (
            <tr key={t.id} className="border-t border-rule/60">
              <td className="py-1.5">{t.name}</td>
              <td className="num">{t.prefix}…</td>
              <td className="num text-ink-soft">{formatDateTime(t.createdAt)}</td>
              <td className="num text-ink-soft">{t.lastUsedAt ? formatDateTime(t.lastUsedAt) : "never"}</td>
              <td className="num text-ink-soft">{t.expiresAt ? formatDate(t.expiresAt) : "does not expire"}</td>
              <td>
                {t.revokedAt ? (
                  <Badge>revoked</Badge>
                ) : t.expired ? (
                  <Badge>expired</Badge>
                ) : (
                  <Badge tone="moss">active</Badge>
                )}
              </td>
              <td className="text-right">
                {!t.revokedAt && !t.expired && (
                  <Button
                    size="sm"
                    variant="danger"
                    onClick={async () => {
                      await sendJson("DELETE", `/api/v1/tokens/${t.id}`);
                      await mutate();
                    }}
                  >
                    Revoke
                  </Button>
                )}
              </td>
            </tr>
          ))}
          {data && data.items.length === 0 && (
            <tr>
              <td colSpan={7} className="py-3 text-ink-soft">
                No tokens yet.
              </td>
            </tr>
          )}
        </tbody>
      </table>
    </div>
  );
}
