import { commentCreateSchema } from "@/lib/contracts/discussion";
import { addComment } from "@/lib/server/discussions/discussions";
import { json, readJson } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

type P = { labId: string; threadId: string };

/** A comment or a reply (`parentId`); answers the thread, the comment and whether e-mail went out. */
export const POST = labRoute<P>("comment.create", async (ctx, request, p) =>
  json(await addComment(ctx, p.threadId, await readJson(request, commentCreateSchema)), 201),
);
