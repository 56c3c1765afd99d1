import { listMail } from "@/lib/server/data/mailbox";
import { json } from "@/lib/server/http";
import { labRoute } from "@/lib/server/lab-route";

export const runtime = "nodejs";

/** Development only: the messages the local fake mail server received. */
export const GET = labRoute("mailbox.read", async () => json({ items: await listMail() }));
