"use client";
/** A textarea for a comment with a simple "@" hint listing lab members. */
import { useLayoutEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { ApiError } from "@/lib/client/api";
import { MAX_COMMENT_CHARS } from "@/lib/contracts/discussion";
import { insertMention, matchMembers, mentionQueryAt, type MemberOption } from "./mention-hint";

export interface CommentBoxProps {
  label: string;
  submitLabel: string;
  members: MemberOption[];
  initial?: string;
  placeholder?: string;
  testId: string;
  onSubmit: (body: string) => Promise<void>;
  onCancel?: () => void;
}

export function CommentBox({
  label,
  submitLabel,
  members,
  initial = "",
  placeholder,
  testId,
  onSubmit,
  onCancel,
}: CommentBoxProps) {
  const ref = useRef<HTMLTextAreaElement>(null);
  const [text, setText] = useState(initial);
  const [hint, setHint] = useState<{ start: number; caret: number; options: MemberOption[]; active: number } | null>(
    null,
  );
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  // Where the caret goes after a picked mention. Placed as soon as React has written the new text, before the
  // browser handles the next key; an animation frame could come after it and pull the caret back.
  const caretAfterPick = useRef<number | null>(null);
  useLayoutEffect(() => {
    const caret = caretAfterPick.current;
    if (caret === null || !ref.current) return;
    caretAfterPick.current = null;
    ref.current.focus();
    ref.current.setSelectionRange(caret, caret);
  }, [text]);

  function refreshHint(value: string, caret: number) {
    const q = mentionQueryAt(value, caret);
    const options = q ? matchMembers(members, q.query) : [];
    setHint(q && options.length ? { start: q.start, caret, options, active: 0 } : null);
  }
  function pick(member: MemberOption) {
    if (!hint) return;
    const next = insertMention(text, hint.start, hint.caret, member);
    caretAfterPick.current = next.caret;
    setText(next.text);
    setHint(null);
  }
  function onKeyDown(e: React.KeyboardEvent<HTMLTextAreaElement>) {
    if (!hint) return;
    if (e.key === "ArrowDown" || e.key === "ArrowUp") {
      e.preventDefault();
      const step = e.key === "ArrowDown" ? 1 : -1;
      setHint({ ...hint, active: (hint.active + step + hint.options.length) % hint.options.length });
    } else if (e.key === "Enter" || e.key === "Tab") {
      e.preventDefault();
      pick(hint.options[hint.active]);
    } else if (e.key === "Escape") {
      setHint(null);
    }
  }
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (!text.trim()) return setError("Write something first.");
    setBusy(true);
    setError(null);
    try {
      await onSubmit(text.trim());
      setText("");
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "The comment could not be saved; try again.");
    } finally {
      setBusy(false);
    }
  }
  return (
    <form onSubmit={submit} className="space-y-2" data-testid={testId}>
      <div className="relative">
        <label className="block space-y-1">
          <span className="text-xs font-medium text-ink-soft">{label}</span>
          <textarea
            ref={ref}
            value={text}
            rows={3}
            maxLength={MAX_COMMENT_CHARS}
            placeholder={placeholder}
            onChange={(e) => {
              setText(e.target.value);
              refreshHint(e.target.value, e.target.selectionStart);
            }}
            onKeyDown={onKeyDown}
            onBlur={() => setTimeout(() => setHint(null), 150)}
            className="w-full rounded-md border border-rule bg-card px-3 py-2 text-sm text-ink placeholder:text-ink-soft/60 focus:border-moss focus:outline-none"
            data-testid={`${testId}-text`}
          />
        </label>
        {hint && (
          <ul
            role="listbox"
            aria-label="Mention a lab member"
            className="absolute left-2 top-full z-10 mt-1 w-72 rounded-md border border-rule bg-card py-1 text-sm shadow-md"
            data-testid="mention-hint"
          >
            {hint.options.map((o, i) => (
              <li key={o.userId} role="option" aria-selected={i === hint.active}>
                <button
                  type="button"
                  onMouseDown={(e) => e.preventDefault()}
                  onClick={() => pick(o)}
                  className={`block w-full px-3 py-1 text-left ${i === hint.active ? "bg-moss-soft text-moss-dark" : "hover:bg-paper-deep"}`}
                >
                  <span className="font-medium">{o.name ?? o.email}</span>{" "}
                  {o.name && <span className="text-xs text-ink-soft">{o.email}</span>}
                </button>
              </li>
            ))}
          </ul>
        )}
      </div>
      {error && (
        <p className="text-xs text-brick" data-testid={`${testId}-error`}>
          {error}
        </p>
      )}
      <div className="flex items-center gap-2">
        <Button type="submit" size="sm" disabled={busy} data-testid={`${testId}-submit`}>
          {busy ? "Saving…" : submitLabel}
        </Button>
        {onCancel && (
          <Button size="sm" variant="ghost" onClick={onCancel}>
            Cancel
          </Button>
        )}
        <span className="text-xs text-ink-soft">
          Type @ to mention a member; **bold**, *italic*, `code`, lists and links work.
        </span>
      </div>
    </form>
  );
}
