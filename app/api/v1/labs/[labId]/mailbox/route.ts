import { listMail } from "@/lib/server/data/mailbox";
import { json } from "@/lib/server/http";
import { labRoute } from "@/lib/server/lab-route";

export const runtime = "nodejs";

/** Development only: the messages the local fake mail server received for this lab's members and invitees. */
export const GET = labRoute<{ labId: string }>("mailbox.read", async (ctx) => json({ items: await listMail(ctx) }));
