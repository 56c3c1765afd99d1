/**
 * @mentions in comment bodies: `@person@lab.org` (an e-mail address) or `@"Full Name"`. Only lab
 * members can be mentioned; anything else is left as plain text.
 */
import "server-only";

export interface Mentionable {
  userId: string;
  name: string | null;
  email: string;
}

const MENTION = /@"([^"\n]{1,120})"|@([A-Za-z0-9._%+-]+@[A-Za-z0-9-]+(?:\.[A-Za-z0-9-]+)+)/g;

/** The names and addresses written as mentions, as typed (lower-cased for matching). */
export function findMentionTokens(body: string): { names: string[]; emails: string[] } {
  const names: string[] = [];
  const emails: string[] = [];
  for (const m of body.matchAll(MENTION)) {
    if (m[1] !== undefined) names.push(m[1].trim().toLowerCase());
    else emails.push(m[2].toLowerCase());
  }
  return { names, emails };
}

/** User ids of the members `body` mentions, each once, in order of first mention. */
export function resolveMentions(body: string, members: Mentionable[]): string[] {
  const { names, emails } = findMentionTokens(body);
  const ids: string[] = [];
  for (const member of members) {
    const byEmail = emails.includes(member.email.toLowerCase());
    const byName = member.name !== null && names.includes(member.name.trim().toLowerCase());
    if ((byEmail || byName) && !ids.includes(member.userId)) ids.push(member.userId);
  }
  return ids;
}
