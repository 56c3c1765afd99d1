/**
 * Discussions through the route handlers: threads, replies, edit/delete, resolve/reopen, who may
 * do what. Expected behaviour is the product rules in the brief and PRODUCT.md
 * ("common practice, no source").
 */
import { describe, expect, it } from "vitest";
import { database } from "@/lib/server/services";
import { discussedUpload } from "./permission-cases/discussions";
import { setupLabApi } from "../support/lab-api";
import { COMMENT, COMMENTS, ONE, T, discussionCalls } from "../support/discussions";

let uploadId = "";
const lab = setupLabApi({
  setup: async (l) => {
    uploadId = await discussedUpload(l.w);
  },
});
const { api, start, reply, getThread } = discussionCalls(lab, () => uploadId);

describe("threads and comments", () => {
  it("starts a thread, lists it on its target, replies (one level), edits, soft-deletes, resolves and reopens with audit", async () => {
    const created = await start("scientist", "Spacing looks **narrower** near the midline.");
    expect(created.status).toBe(201);
    expect(created.body.thread).toMatchObject({
      status: "open",
      commentCount: 1,
      target: { type: "upload", id: uploadId },
    });
    expect(created.body.thread.target.label).toMatch(/^the file “a\.png” of specimen X\d+$/);
    expect(created.body.comment).toMatchObject({
      body: "Spacing looks **narrower** near the midline.",
      authorEmail: lab.w.people.scientist.email,
      canEdit: true,
      canDelete: true,
      deleted: false,
      editedAt: null,
    });
    expect(created.body.comment.bodyHtml).toBe("<p>Spacing looks <strong>narrower</strong> near the midline.</p>");
    const threadId = created.body.thread.id as string;
    const first = created.body.comment.id as string;

    const listed = await api("GET", T, "collaborator", {
      query: `targetType=upload&targetId=${uploadId}&pageSize=100`,
    });
    expect(listed.status).toBe(200);
    const mine = listed.body.items.find((t: { id: string }) => t.id === threadId);
    expect(mine.comments.map((c: { id: string }) => c.id)).toEqual([first]);
    expect(mine.comments[0]).toMatchObject({ canEdit: false, canDelete: false });

    const r1 = await reply("modeller", threadId, "Agreed; compare with the control.", first);
    expect(r1.status).toBe(201);
    expect(r1.body.comment.parentId).toBe(first);
    // A reply to a reply joins the top-level comment.
    const r2 = await reply("collaborator", threadId, "Which control?", r1.body.comment.id);
    expect(r2.body.comment.parentId).toBe(first);
    const other = await reply("collaborator", threadId, "x", "00000000-0000-4000-8000-000000000000");
    expect(other.status).toBe(404);
    expect(other.body.error.message).toBe("parentId: the comment replied to is not in this thread");

    const edited = await api("PATCH", COMMENT, "modeller", {
      params: { threadId, commentId: r1.body.comment.id },
      json: { body: "Agreed; compare with control 2." },
    });
    expect(edited.status).toBe(200);
    expect(edited.body.comment.body).toBe("Agreed; compare with control 2.");
    expect(edited.body.comment.editedAt).not.toBeNull();

    expect((await api("DELETE", COMMENT, "scientist", { params: { threadId, commentId: first } })).status).toBe(204);
    const after = await getThread("collaborator", threadId);
    expect(
      after.body.comments.map((c: { deleted: boolean; body: string; bodyHtml: string }) => [
        c.deleted,
        c.body === "",
        c.bodyHtml === "",
      ]),
    ).toEqual([
      [true, true, true],
      [false, false, false],
      [false, false, false],
    ]);
    expect(after.body.comments[0].canEdit).toBe(false);
    expect(after.body.commentCount).toBe(2);
    expect(after.body.preview).toBe("(comment deleted)");
    const editDeleted = await api("PATCH", COMMENT, "scientist", {
      params: { threadId, commentId: first },
      json: { body: "back" },
    });
    expect(editDeleted.status).toBe(409);

    const resolved = await api("PATCH", ONE, "collaborator", { params: { threadId }, json: { status: "resolved" } });
    expect(resolved.body).toMatchObject({ status: "resolved", resolvedByName: lab.w.people.collaborator.actor.name });
    const open = await api("GET", T, "scientist", { query: "status=open&pageSize=200" });
    expect(open.body.items.map((t: { id: string }) => t.id)).not.toContain(threadId);
    expect(open.body.items.every((t: { comments?: unknown }) => t.comments === undefined)).toBe(true);
    const reopened = await api("PATCH", ONE, "modeller", { params: { threadId }, json: { status: "open" } });
    expect(reopened.body).toMatchObject({ status: "open", resolvedAt: null, resolvedByName: null });
    const bad = await api("PATCH", ONE, "modeller", { params: { threadId }, json: { status: "closed" } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toBe("status: must be “open” or “resolved”");

    const m = await database();
    const audit = await m.AuditEvent.findAll({
      where: { labId: lab.w.labId, targetId: uploadId },
      order: [["createdAt", "asc"]],
    });
    const actions = audit.map((a) => a.action).filter((a) => a.startsWith("discussion.") || a.startsWith("comment."));
    expect(actions).toEqual(
      expect.arrayContaining(["discussion.started", "comment.deleted", "discussion.resolved", "discussion.reopened"]),
    );
    expect(audit.find((a) => a.action === "discussion.resolved")!.summary).toMatch(
      new RegExp(`^${lab.w.people.collaborator.email} resolved a discussion on the file “a.png”`),
    );
  });

  it("lets a collaborator comment and edit their own comment, but not edit or delete someone else's", async () => {
    const t = await start("collaborator", "Could you share the raw image?");
    expect(t.status).toBe(201);
    const threadId = t.body.thread.id;
    const own = await api("PATCH", COMMENT, "collaborator", {
      params: { threadId, commentId: t.body.comment.id },
      json: { body: "Could you share the raw TIFF?" },
    });
    expect(own.status).toBe(200);
    const theirs = await reply("scientist", threadId, "Uploaded it.");
    for (const method of ["PATCH", "DELETE"] as const) {
      const res = await api(method, COMMENT, "collaborator", {
        params: { threadId, commentId: theirs.body.comment.id },
        json: method === "PATCH" ? { body: "hijack" } : undefined,
      });
      expect(res.status).toBe(403);
      expect(res.body.error.message).toBe("only its creator or a lab manager may change or delete this");
    }
    expect((await getThread("scientist", threadId)).body.comments[1].body).toBe("Uploaded it.");
  });

  it("lets the lab manager delete anyone's comment, and nobody else", async () => {
    const t = await start("scientist", "Draft conclusion: the inhibitor widens spacing.");
    const threadId = t.body.thread.id;
    const modellerTry = await api("DELETE", COMMENT, "modeller", {
      params: { threadId, commentId: t.body.comment.id },
    });
    expect(modellerTry.status).toBe(403);
    const managerSees = await getThread("manager", threadId);
    expect(managerSees.body.comments[0]).toMatchObject({ canEdit: true, canDelete: true });
    expect(
      (await api("DELETE", COMMENT, "manager", { params: { threadId, commentId: t.body.comment.id } })).status,
    ).toBe(204);
    const m = await database();
    const entry = await m.AuditEvent.findOne({
      where: { labId: lab.w.labId, action: "comment.deleted" },
      order: [["createdAt", "desc"]],
    });
    expect(entry!.summary).toBe(
      `${lab.w.people.manager.email} deleted a comment by ${lab.w.people.scientist.email} on ${t.body.thread.target.label}`,
    );
  });

  it("answers 404 for another lab's thread, a target outside the lab, and fits (no fits yet)", async () => {
    const t = await start("scientist", "Lab-internal note.");
    const threadId = t.body.thread.id;
    // The outsider asks under their own lab, where this thread does not exist.
    const asOutsider = { labId: lab.w.otherLabId, params: { threadId } };
    expect((await api("GET", ONE, lab.w.outsider, asOutsider)).status).toBe(404);
    expect((await api("POST", COMMENTS, lab.w.outsider, { ...asOutsider, json: { body: "hi" } })).status).toBe(404);
    expect((await api("PATCH", ONE, lab.w.outsider, { ...asOutsider, json: { status: "resolved" } })).status).toBe(404);
    expect(
      (
        await api("DELETE", COMMENT, lab.w.outsider, {
          labId: lab.w.otherLabId,
          params: { threadId, commentId: t.body.comment.id },
        })
      ).status,
    ).toBe(404);
    const foreignTarget = await api("POST", T, lab.w.outsider, {
      labId: lab.w.otherLabId,
      json: { targetType: "upload", targetId: uploadId, body: "x" },
    });
    expect(foreignTarget.status).toBe(404);
    expect(foreignTarget.body.error.message).toBe("upload not found");
    const fit = await start("scientist", "About the fit.", {
      targetType: "fit",
      targetId: "7f1c2a8e-3b4d-4c5e-8f60-718293a4b5c6",
    });
    expect(fit.status).toBe(404);
    expect(fit.body.error.message).toBe("fit not found");
    const readout = await start("scientist", "About a readout.", {
      targetType: "readout",
      targetId: "7f1c2a8e-3b4d-4c5e-8f60-718293a4b5c6",
    });
    expect(readout.body.error.message).toBe("readout not found");
  });

  it("names the field and the limit in bad input", async () => {
    expect((await start("scientist", "   ")).body.error.message).toBe("body: write a comment");
    expect((await start("scientist", "x".repeat(10_001))).body.error.message).toBe("body: at most 10000 characters");
    expect((await start("scientist", "x", { targetType: "study" })).body.error.message).toBe(
      "targetType: must be one of readout, fit, upload",
    );
    expect((await start("scientist", "x", { targetId: "nope" })).body.error.message).toBe("targetId must be a UUID");
    const half = await api("GET", T, "scientist", { query: "targetType=upload" });
    expect(half.status).toBe(400);
    expect(half.body.error.message).toBe("targetId: give targetType and targetId together");
  });
});
