/** Pure helpers for the "@" hint of the comment box: what is being typed, and what to insert. */
export interface MemberOption {
  userId: string;
  name: string | null;
  email: string;
}

/** The partial mention just before the caret (`@mar` → { start, query: "mar" }), or null. */
export function mentionQueryAt(text: string, caret: number): { start: number; query: string } | null {
  const before = text.slice(0, caret);
  const m = before.match(/(^|\s)@("?)([^\s"@]*)$/);
  if (!m) return null;
  return { start: caret - m[2].length - m[3].length - 1, query: m[3].toLowerCase() };
}

/** Members whose name or e-mail contains the query, at most `limit`. */
export function matchMembers(members: MemberOption[], query: string, limit = 6): MemberOption[] {
  return members
    .filter((x) => (x.name ?? "").toLowerCase().includes(query) || x.email.toLowerCase().includes(query))
    .slice(0, limit);
}

/** How a member is written in a body: by name when they have one, else by address. */
export function mentionText(member: MemberOption): string {
  return member.name ? `@"${member.name}"` : `@${member.email}`;
}

/** The text with the partial mention at `start…caret` replaced; returns the new text and caret. */
export function insertMention(
  text: string,
  start: number,
  caret: number,
  member: MemberOption,
): { text: string; caret: number } {
  const insert = `${mentionText(member)} `;
  return { text: text.slice(0, start) + insert + text.slice(caret), caret: start + insert.length };
}
