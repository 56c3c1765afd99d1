/**
 * E-mail notifications about discussions, through the one mailer of `services()`. Who hears:
 * the people a comment mentions and the thread's participants (authors of earlier comments),
 * never the author, never someone who left the lab, never someone who turned e-mail off.
 * Sending never throws: the comment is already saved, so a failure is logged and reported.
 */
import "server-only";
import { Op } from "sequelize";
import type { DiscussionTarget, NotificationOutcome } from "@/lib/contracts/discussion";
import type { LabContext } from "../access";
import { database, services } from "../services";

/** Longest wait for the mail server before the request answers anyway, ms. */
const SEND_BUDGET_MS = 15_000;

export interface DiscussionNotice {
  target: DiscussionTarget;
  /** The comment as typed. */
  body: string;
  /** Users the comment mentions. */
  mentionedIds: string[];
  /** Authors of earlier comments in the thread. */
  participantIds: string[];
  /** True when this is an edit: only newly mentioned people hear about it. */
  edited?: boolean;
}

interface Recipient {
  email: string;
  mentioned: boolean;
}

async function pickRecipients(ctx: LabContext, n: DiscussionNotice): Promise<Recipient[]> {
  const ids = [...new Set([...n.mentionedIds, ...n.participantIds])].filter((id) => id !== ctx.actor.userId);
  if (ids.length === 0) return [];
  const m = await database();
  const members = await m.Membership.findAll({
    where: { labId: ctx.labId, userId: { [Op.in]: ids } },
    attributes: ["userId"],
  });
  const users = await m.User.findAll({
    where: { id: members.map((x) => x.userId), notifyByEmail: true },
    attributes: ["id", "email"],
  });
  return users.map((u) => ({ email: u.email, mentioned: n.mentionedIds.includes(u.id) }));
}

function composeMail(ctx: LabContext, n: DiscussionNotice, r: Recipient) {
  const { appUrl } = services().config;
  const who = ctx.actor.name ?? ctx.actor.email;
  const link = `${appUrl}${n.target.path ?? `/labs/${ctx.labId}`}`;
  const verb = r.mentioned ? "mentioned you on" : "commented on";
  const why = r.mentioned ? "you were mentioned" : "you took part in this discussion";
  return {
    to: r.email,
    subject: `[${ctx.labName}] ${who} ${verb} ${n.target.label}`,
    text: [
      `${who} ${verb} ${n.target.label} in ${ctx.labName}${n.edited ? " (in an edited comment)" : ""}:`,
      "",
      n.body,
      "",
      `Open the discussion: ${link}`,
      "",
      `You get this e-mail because ${why}. Turn these e-mails off under “E-mail notifications” on your account page: ${appUrl}/account`,
    ].join("\n"),
  };
}

function timeout(ms: number): Promise<"timeout"> {
  return new Promise((resolve) => setTimeout(() => resolve("timeout"), ms).unref?.());
}

/** Sends one e-mail per recipient; reports how many went out and, when some did not, why. */
export async function notifyDiscussion(ctx: LabContext, n: DiscussionNotice): Promise<NotificationOutcome> {
  let recipients: Recipient[];
  try {
    recipients = await pickRecipients(ctx, { ...n, participantIds: n.edited ? [] : n.participantIds });
  } catch (err) {
    console.error("discussion notification: could not pick recipients", err);
    return { notified: false, recipients: 0, reason: "the recipients could not be looked up; nobody was notified" };
  }
  if (recipients.length === 0) return { notified: true, recipients: 0 };
  const { mailer } = services();
  const sending = Promise.allSettled(recipients.map((r) => mailer.send(composeMail(ctx, n, r))));
  const settled = await Promise.race([sending, timeout(SEND_BUDGET_MS)]);
  if (settled === "timeout") {
    console.error(`discussion notification: the mail server did not answer within ${SEND_BUDGET_MS / 1000} s`);
    return {
      notified: false,
      recipients: 0,
      reason: `the mail server did not answer within ${SEND_BUDGET_MS / 1000} s; the comment is saved but ${recipients.length} notification e-mail(s) may not have been sent`,
    };
  }
  const failed = settled.filter((s): s is PromiseRejectedResult => s.status === "rejected");
  if (failed.length === 0) return { notified: true, recipients: recipients.length };
  console.error(`discussion notification: ${failed.length} of ${recipients.length} e-mail(s) failed`, failed[0].reason);
  return {
    notified: false,
    recipients: recipients.length - failed.length,
    reason: `the mail server could not be reached or refused the message; the comment is saved but ${failed.length} of ${recipients.length} notification e-mail(s) were not sent`,
  };
}
