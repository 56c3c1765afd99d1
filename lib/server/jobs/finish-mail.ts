/**
 * The one mail hook: a job that ran longer than JOB_MAIL_AFTER_S seconds (default 10) e-mails its
 * requester when it finishes or fails, unless they turned e-mail off. A job may name itself and
 * its page in its payload (`title`, `path`). Fire and forget: a mail failure is logged and never
 * changes the job's status, which is already written.
 */
import "server-only";
import { database, services } from "../services";
import type { JobInput } from "./types";

export function mailIfLong(
  job: JobInput,
  status: "succeeded" | "failed",
  error: string | null,
  startedMs: number,
): void {
  const seconds = (Date.now() - startedMs) / 1000;
  if (!job.requestedBy || !(seconds > services().config.jobMailAfterS)) return;
  void (async () => {
    const m = await database();
    const user = await m.User.findByPk(job.requestedBy!, { attributes: ["email", "notifyByEmail"] });
    if (!user || user.notifyByEmail === false) return;
    const lab = await m.Lab.findByPk(job.labId, { attributes: ["name"] });
    const { appUrl } = services().config;
    const title = typeof job.payload.title === "string" ? job.payload.title : `your ${job.kind} job`;
    const link = `${appUrl}${typeof job.payload.path === "string" ? job.payload.path : `/labs/${job.labId}`}`;
    const verb = status === "succeeded" ? "finished" : "failed";
    await services().mailer.send({
      to: user.email,
      subject: `[${lab?.name ?? "Morphokin"}] ${title.charAt(0).toUpperCase()}${title.slice(1)} ${verb}`,
      text: [
        `${title.charAt(0).toUpperCase()}${title.slice(1)} ${verb} after ${Math.round(seconds)} s.`,
        ...(error ? ["", `Why: ${error}`] : []),
        "",
        `Open it: ${link}`,
        "",
        `Turn these e-mails off under “E-mail notifications” on your account page: ${appUrl}/account`,
      ].join("\n"),
    });
  })().catch((err) => console.error(`job ${job.kind} ${job.id}: the finish e-mail could not be sent`, err));
}
