import { commentUpdateSchema } from "@/lib/contracts/discussion";
import { deleteComment, editComment } from "@/lib/server/discussions/discussions";
import { json, readJson } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

type P = { labId: string; threadId: string; commentId: string };

export const PATCH = labRoute<P>("comment.edit", async (ctx, request, p) =>
  json(await editComment(ctx, p.threadId, p.commentId, await readJson(request, commentUpdateSchema))),
);

/** Soft delete: a "comment deleted" placeholder stays so replies still read. */
export const DELETE = labRoute<P>("comment.delete", async (ctx, _request, p) => {
  await deleteComment(ctx, p.threadId, p.commentId);
  return new Response(null, { status: 204 });
});
