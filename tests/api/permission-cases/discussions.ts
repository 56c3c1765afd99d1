/** Discussion routes: threads of a target or of the lab, one thread, comments, edit/delete, resolve/reopen. */
import { createThread } from "@/lib/server/discussions/discussions";
import type { World } from "../../support/world";
import { ALL, MANAGER_ONLY, lab, managerCtx, upload, type Case } from "./shared";

/** One upload per world to talk about (storing files is the slow part). */
const uploads = new WeakMap<World, Promise<string>>();
export function discussedUpload(w: World): Promise<string> {
  if (!uploads.has(w))
    uploads.set(
      w,
      upload(w).then((u) => u.id),
    );
  return uploads.get(w)!;
}

/** A fresh thread started by the lab manager, with the manager's first comment. */
export async function managerThread(w: World) {
  return createThread(managerCtx(w), {
    targetType: "upload",
    targetId: await discussedUpload(w),
    body: "Is the spacing in the lower half narrower?",
  });
}

const T = "/api/v1/labs/[labId]/threads";

export const cases: Record<string, Case> = {
  [`GET ${T}`]: {
    setup: async (w) => ({ params: lab(w), query: `targetType=upload&targetId=${await discussedUpload(w)}` }),
    expect: ALL(200),
  },
  // Everyone in the lab, collaborators included, may start a discussion.
  [`POST ${T}`]: {
    setup: async (w) => ({
      params: lab(w),
      json: { targetType: "upload", targetId: await discussedUpload(w), body: "A question." },
    }),
    expect: ALL(201),
  },
  [`GET ${T}/[threadId]`]: {
    setup: async (w) => ({ params: lab(w, { threadId: (await managerThread(w)).thread.id }) }),
    expect: ALL(200),
  },
  [`PATCH ${T}/[threadId]`]: {
    setup: async (w) => ({
      params: lab(w, { threadId: (await managerThread(w)).thread.id }),
      json: { status: "resolved" },
    }),
    expect: ALL(200),
  },
  [`POST ${T}/[threadId]/comments`]: {
    setup: async (w) => ({
      params: lab(w, { threadId: (await managerThread(w)).thread.id }),
      json: { body: "A reply." },
    }),
    expect: ALL(201),
  },
  // The manager's own comment: only the manager may edit or delete it.
  [`PATCH ${T}/[threadId]/comments/[commentId]`]: {
    setup: async (w) => {
      const t = await managerThread(w);
      return { params: lab(w, { threadId: t.thread.id, commentId: t.comment.id }), json: { body: "Edited." } };
    },
    expect: MANAGER_ONLY(200),
  },
  [`DELETE ${T}/[threadId]/comments/[commentId]`]: {
    setup: async (w) => {
      const t = await managerThread(w);
      return { params: lab(w, { threadId: t.thread.id, commentId: t.comment.id }) };
    },
    expect: MANAGER_ONLY(204),
  },
};
