/**
 * Conditions are typed by people: "Kontrolle", "kontrolle " and "Kontrolle" name one condition.
 * They are matched without regard to case, Unicode form and surrounding or repeated spaces, and
 * shown in the spelling seen first.
 */

/** The key two spellings of one condition share. */
export function conditionKey(name: string): string {
  return name.normalize("NFC").trim().replace(/\s+/g, " ").toLowerCase();
}

export interface ConditionSpellings {
  /** The condition as shown: the first spelling seen for its key (trimmed). */
  displayOf(name: string): string;
  /** Groups of more than one spelling, each as written, for a warning. */
  merged(): string[][];
}

/** Collects the spellings of conditions in the order given. */
export function collectConditionSpellings(names: Iterable<string>): ConditionSpellings {
  const first = new Map<string, string>();
  const all = new Map<string, Set<string>>();
  for (const n of names) {
    const k = conditionKey(n);
    if (!first.has(k)) first.set(k, n.trim().replace(/\s+/g, " "));
    all.set(k, (all.get(k) ?? new Set()).add(n));
  }
  return {
    displayOf: (name) => first.get(conditionKey(name)) ?? name.trim(),
    merged: () => [...all.values()].filter((s) => s.size > 1).map((s) => [...s]),
  };
}
