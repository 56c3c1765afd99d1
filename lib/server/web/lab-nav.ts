/** The navigation of a lab, showing only what the role may open. */
import "server-only";
import { can } from "@/lib/access/permissions";
import type { Role } from "@/lib/access/roles";
import { mailboxEnabled } from "../labs/mailbox";

export function labNav(labId: string, role: Role) {
  const base = `/labs/${labId}`;
  const items = [
    { href: base, label: "Dashboard" },
    { href: `${base}/studies`, label: "Studies" },
    { href: `${base}/readouts`, label: "Readouts" },
    { href: `${base}/kinetics`, label: "Kinetics" },
    { href: `${base}/fits`, label: "Fits" },
    { href: `${base}/runs`, label: "Runs" },
    { href: `${base}/members`, label: "Members" },
  ];
  if (can(role, "audit.read")) items.push({ href: `${base}/audit`, label: "Audit trail" });
  if (can(role, "mailbox.read") && mailboxEnabled()) items.push({ href: `${base}/mailbox`, label: "Mailbox (dev)" });
  return items;
}
