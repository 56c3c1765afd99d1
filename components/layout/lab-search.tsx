"use client";

import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, useState } from "react";
import { fetchJson } from "@/lib/client/api";
import { SEARCH_MIN_CHARS, type SearchAnswer, type SearchHit } from "@/lib/contracts/search";
import { useSearchShortcut } from "./use-search-shortcut";

/** Wait after the last key before asking the server, so typing a word sends one request, not one per letter. */
const TYPING_PAUSE_MS = 200;

/** The server's answer for one text (or why there is none). */
type Fetched = { q: string; answer: SearchAnswer } | { q: string; error: string };

type Suggestions =
  | { state: "idle" }
  | { state: "short" }
  | { state: "loading" }
  | { state: "done"; answer: SearchAnswer }
  | { state: "failed"; message: string };

/** What the list shows for the text in the box: derived, so a stale answer never shows under new text. */
function suggestionsFor(text: string, fetched: Fetched | null): Suggestions {
  if (text.length === 0) return { state: "idle" };
  if (text.length < SEARCH_MIN_CHARS) return { state: "short" };
  if (!fetched || fetched.q !== text) return { state: "loading" };
  return "answer" in fetched ? { state: "done", answer: fetched.answer } : { state: "failed", message: fetched.error };
}

/**
 * The lab's search box in the header: suggestions grouped by kind while typing, arrow keys move
 * through them, Enter opens the one chosen or the full results page; "/" or Ctrl/⌘+K focuses it.
 * It follows the ARIA combobox pattern (w3.org/WAI/ARIA/apg/patterns/combobox/), so a screen
 * reader announces the option the arrow keys reach while focus stays in the box.
 */
export function LabSearch({ labId, className = "" }: { labId: string; className?: string }) {
  const router = useRouter();
  const listId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const [q, setQ] = useState("");
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);
  const [fetched, setFetched] = useState<Fetched | null>(null);
  useSearchShortcut(inputRef);

  const text = q.trim();
  const found = suggestionsFor(text, fetched);
  useEffect(() => {
    if (text.length < SEARCH_MIN_CHARS) return;
    let current = true;
    const timer = setTimeout(() => {
      fetchJson<SearchAnswer>(`/api/v1/labs/${labId}/search?q=${encodeURIComponent(text)}`)
        .then((answer) => current && setFetched({ q: text, answer }))
        .catch((err: Error) => current && setFetched({ q: text, error: err.message }));
    }, TYPING_PAUSE_MS);
    return () => {
      current = false;
      clearTimeout(timer);
    };
  }, [labId, text]);

  const hits: SearchHit[] = found.state === "done" ? found.answer.groups.flatMap((g) => g.items) : [];
  // The last option is always "all results", so Enter on it and Enter with none chosen agree.
  const optionCount = found.state === "done" ? hits.length + 1 : 0;
  const resultsHref = `/labs/${labId}/search?q=${encodeURIComponent(text)}`;
  const optionId = (i: number) => `${listId}-option-${i}`;

  const go = (href: string) => {
    setOpen(false);
    setActive(-1);
    inputRef.current?.blur();
    router.push(href);
  };

  const onKeyDown = (e: React.KeyboardEvent<HTMLInputElement>) => {
    if (e.key === "ArrowDown" || e.key === "ArrowUp") {
      e.preventDefault();
      setOpen(true);
      if (optionCount === 0) return;
      const step = e.key === "ArrowDown" ? 1 : -1;
      setActive((a) => (a < 0 ? (step > 0 ? 0 : optionCount - 1) : (a + step + optionCount) % optionCount));
    } else if (e.key === "Enter") {
      e.preventDefault();
      if (active >= 0 && active < hits.length) go(hits[active].href);
      else if (text.length >= SEARCH_MIN_CHARS) go(resultsHref);
    } else if (e.key === "Escape") {
      if (open && text) setOpen(false);
      else inputRef.current?.blur();
    }
  };

  const showList = open && found.state !== "idle";
  let index = 0;
  return (
    <div className={`relative ${className}`} role="search">
      <label className="sr-only" htmlFor={`${listId}-input`}>
        Search the lab
      </label>
      <input
        ref={inputRef}
        id={`${listId}-input`}
        type="search"
        role="combobox"
        aria-autocomplete="list"
        aria-expanded={showList}
        aria-controls={listId}
        aria-activedescendant={showList && active >= 0 ? optionId(active) : undefined}
        aria-keyshortcuts="/ Control+K Meta+K"
        autoComplete="off"
        spellCheck={false}
        placeholder="Search the lab"
        value={q}
        onChange={(e) => {
          setQ(e.target.value);
          setOpen(true);
          setActive(-1);
        }}
        onFocus={() => setOpen(true)}
        onBlur={() => setOpen(false)}
        onKeyDown={onKeyDown}
        className="w-full rounded-md border border-rule bg-card py-1.5 pl-3 pr-24 text-sm text-ink placeholder:text-ink-soft/70 focus:border-moss focus:outline-none [&::-webkit-search-cancel-button]:hidden"
        data-testid="lab-search-input"
      />
      <span
        className="pointer-events-none absolute inset-y-0 right-2 flex items-center gap-1 text-[11px] text-ink-soft"
        aria-hidden="true"
        data-testid="lab-search-hint"
      >
        <kbd className="rounded border border-rule bg-paper px-1 font-mono">/</kbd>
        <kbd className="rounded border border-rule bg-paper px-1 font-mono">Ctrl K</kbd>
      </span>
      {showList && (
        <div
          id={listId}
          role="listbox"
          aria-label="Search suggestions"
          // Pressing an option must not blur the box first (which would close the list before the click).
          onMouseDown={(e) => e.preventDefault()}
          className="absolute right-0 z-30 mt-1 max-h-[70vh] w-full min-w-72 overflow-y-auto rounded-md border border-rule bg-card py-1 text-sm shadow-lg md:w-[26rem]"
          data-testid="lab-search-list"
        >
          {found.state === "short" && <Note>Type at least {SEARCH_MIN_CHARS} characters.</Note>}
          {found.state === "loading" && <Note>Searching…</Note>}
          {found.state === "failed" && <Note>Search failed: {found.message}</Note>}
          {found.state === "done" && found.answer.groups.length === 0 && (
            <Note>Nothing in this lab matches “{found.answer.q}”.</Note>
          )}
          {found.state === "done" &&
            found.answer.groups.map((g) => (
              <div key={g.kind} role="group" aria-labelledby={`${listId}-${g.kind}`}>
                <div
                  id={`${listId}-${g.kind}`}
                  className="px-3 pb-0.5 pt-2 text-[11px] font-semibold uppercase tracking-wide text-ink-soft"
                >
                  {g.label}
                </div>
                {g.items.map((hit) => {
                  const i = index++;
                  return (
                    <Option
                      key={`${hit.kind}:${hit.id}`}
                      id={optionId(i)}
                      active={i === active}
                      onPick={() => go(hit.href)}
                    >
                      <span className="block truncate font-medium text-ink" title={hit.name}>
                        {hit.name}
                      </span>
                      <span className="block truncate text-xs text-ink-soft" title={hit.context}>
                        {hit.context}
                      </span>
                    </Option>
                  );
                })}
              </div>
            ))}
          {found.state === "done" && (
            <Option id={optionId(hits.length)} active={active === hits.length} onPick={() => go(resultsHref)}>
              <span className="block truncate text-moss">All results for “{found.answer.q}” (Enter)</span>
            </Option>
          )}
        </div>
      )}
    </div>
  );
}

function Note({ children }: { children: React.ReactNode }) {
  return (
    <p className="px-3 py-2 text-ink-soft" role="status">
      {children}
    </p>
  );
}

function Option({
  id,
  active,
  onPick,
  children,
}: {
  id: string;
  active: boolean;
  onPick: () => void;
  children: React.ReactNode;
}) {
  return (
    <div
      id={id}
      role="option"
      aria-selected={active}
      onClick={onPick}
      className={`cursor-pointer px-3 py-1.5 ${active ? "bg-moss-soft" : "hover:bg-paper-deep"}`}
    >
      {children}
    </div>
  );
}
