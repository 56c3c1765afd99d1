import { threadUpdateSchema } from "@/lib/contracts/discussion";
import { getThread, setThreadStatus } from "@/lib/server/discussions/discussions";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

type P = { labId: string; threadId: string };

export const GET = labReadRoute<P>("lab.read", async (ctx, _request, p) => json(await getThread(ctx, p.threadId)));

/** { status: "open" | "resolved" }: resolve or reopen. */
export const PATCH = labRoute<P>("comment.create", async (ctx, request, p) =>
  json(await setThreadStatus(ctx, p.threadId, (await readJson(request, threadUpdateSchema)).status)),
);
