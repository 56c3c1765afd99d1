/**
 * The words of the 403 page: which lab page was refused (from its path, which proxy.ts passes on
 * as `x-morphokin-path`) and what the visitor's role there may and may not do. Pages refuse with
 * `forbidden()` (see `pageLab`); the forbidden page has no parameters, so it reads the path.
 */
import "server-only";
import { can, type Action } from "@/lib/access/permissions";
import { describeRefusal } from "@/lib/access/refusals";
import { requireLab } from "../access";
import { getActor } from "../accounts/actor";

/** Lab pages that a role may be refused, and the action each needs (as its page asks `pageLab`). */
const PAGE_ACTIONS: [RegExp, Action, string][] = [
  [/^fits\/new\/?$/, "fit.create", "this fit"],
  [/^runs\/new\/?$/, "run.create", "this run"],
  [/^kinetics\/new\/?$/, "kinetics.edit", "this kinetics"],
  [/^kinetics\/[^/]+\/edit\/?$/, "kinetics.edit", "this kinetics"],
  [/^audit(\/.*)?$/, "audit.read", "the audit trail"],
  [/^mailbox(\/.*)?$/, "mailbox.read", "the mailbox"],
];

export interface PageRefusal {
  message: string;
  labId: string | null;
}

const GENERIC = "Your role in this lab does not allow this page.";

/** What to tell the visitor refused the lab page at `path` (`/labs/<labId>/fits/new`). */
export async function describePageRefusal(path: string | null): Promise<PageRefusal> {
  const m = /^\/labs\/([^/]+)\/(.*)$/.exec(path ?? "");
  if (!m) return { message: GENERIC, labId: null };
  const [, labId, rest] = m;
  const page = PAGE_ACTIONS.find(([re]) => re.test(rest));
  const actor = await getActor();
  if (!page || !actor) return { message: GENERIC, labId };
  const ctx = await requireLab(actor, labId).catch(() => null);
  if (!ctx) return { message: GENERIC, labId: null };
  const [, action, what] = page;
  // The role may do this in general, but not to this object: it belongs to someone else.
  if (can(ctx.role, action)) return { message: `Only its creator or a lab manager can change ${what}.`, labId };
  return { message: describeRefusal(ctx.role, action), labId };
}
