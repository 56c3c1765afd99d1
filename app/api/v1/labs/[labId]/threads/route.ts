import { threadCreateSchema, threadFilterSchema } from "@/lib/contracts/discussion";
import { createThread, listThreads, THREAD_SORTS } from "@/lib/server/discussions/discussions";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

/** ?targetType=&targetId= : one target's threads with comments, open first. ?status=open : the lab's open discussions. */
export const GET = labReadRoute("lab.read", async (ctx, request) => {
  const p = new URL(request.url).searchParams;
  const filter = threadFilterSchema.parse({
    targetType: p.get("targetType") ?? undefined,
    targetId: p.get("targetId") ?? undefined,
    status: p.get("status") ?? undefined,
  });
  return json(await listThreads(ctx, filter, parseListQuery(request.url, THREAD_SORTS, "lastActivityAt", "desc")));
});

/** A new thread with its first comment; answers the thread, the comment and whether e-mail went out. */
export const POST = labRoute("comment.create", async (ctx, request) =>
  json(await createThread(ctx, await readJson(request, threadCreateSchema)), 201),
);
