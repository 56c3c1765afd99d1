import { listMail } from "@/lib/server/labs/mailbox";
import { json } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Development only: the messages the local fake mail server received for this lab's members and invitees. */
export const GET = labRoute<{ labId: string }>("mailbox.read", async (ctx) => json({ items: await listMail(ctx) }));
