"use client";
/**
 * The study's conditions as a list: each once (spellings that differ only in case or spaces are one
 * condition), with its specimen count; those who may edit the study rename a condition on every
 * specimen at once. The list also offers the names to the specimen form (a datalist).
 */
import { useState } from "react";
import useSWR from "swr";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { ApiError, fetchJson, sendJson } from "@/lib/client/api";
import type { StudyConditionDto } from "@/lib/server/studies/conditions";

export const CONDITIONS_LIST_ID = "study-conditions";

export function StudyConditions({
  labId,
  studyId,
  canEdit,
  refreshKey,
  onRenamed,
}: {
  labId: string;
  studyId: string;
  canEdit: boolean;
  refreshKey: number;
  onRenamed: () => void;
}) {
  const url = `/api/v1/labs/${labId}/studies/${studyId}/conditions`;
  const { data, mutate } = useSWR<{ items: StudyConditionDto[] }>(`${url}#${refreshKey}`, () =>
    fetchJson<{ items: StudyConditionDto[] }>(url),
  );
  const [renaming, setRenaming] = useState<string | null>(null);
  const [to, setTo] = useState("");
  const [error, setError] = useState<string | null>(null);
  const items = data?.items ?? [];

  async function rename(from: string) {
    setError(null);
    try {
      await sendJson("PATCH", url, { from, to });
      setRenaming(null);
      await mutate();
      onRenamed();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The condition could not be renamed.");
    }
  }

  return (
    <Panel title="Conditions">
      <datalist id={CONDITIONS_LIST_ID}>
        {items.map((c) => (
          <option key={c.name} value={c.name} />
        ))}
      </datalist>
      {items.length === 0 ? (
        <p className="text-sm text-ink-soft">Conditions appear here as specimens are added.</p>
      ) : (
        <ul className="divide-y divide-rule text-sm" data-testid="study-conditions">
          {items.map((c) => (
            <li key={c.name} className="flex flex-wrap items-center gap-3 py-1.5">
              <span className="min-w-0 font-medium [overflow-wrap:anywhere]">{c.name}</span>
              <span className="num text-ink-soft">
                {c.specimens} specimen{c.specimens === 1 ? "" : "s"}
              </span>
              {c.otherSpellings.length > 0 && (
                <span className="text-xs text-ink-soft">
                  also written {c.otherSpellings.map((s) => `“${s}”`).join(", ")}
                </span>
              )}
              {canEdit && renaming !== c.name && (
                <Button
                  variant="ghost"
                  onClick={() => {
                    setRenaming(c.name);
                    setTo(c.name);
                    setError(null);
                  }}
                >
                  Rename
                </Button>
              )}
              {renaming === c.name && (
                <span className="flex items-center gap-2">
                  <label className="sr-only" htmlFor={`rename-${c.name}`}>
                    New name for {c.name}
                  </label>
                  <input
                    id={`rename-${c.name}`}
                    className="rounded border border-rule px-2 py-1"
                    value={to}
                    onChange={(e) => setTo(e.target.value)}
                    data-testid="condition-new-name"
                  />
                  <Button onClick={() => rename(c.name)}>Rename on all {c.specimens}</Button>
                  <Button variant="ghost" onClick={() => setRenaming(null)}>
                    Cancel
                  </Button>
                </span>
              )}
            </li>
          ))}
        </ul>
      )}
      {error && (
        <div className="mt-2">
          <Notice tone="error">{error}</Notice>
        </div>
      )}
    </Panel>
  );
}
