/**
 * Discussions through the route handlers: threads, replies, edit/delete, resolve/reopen, who may
 * do what, sanitised bodies, @mentions and the e-mails they cause (read back from the fake SMTP
 * server's mailbox). Expected behaviour is the product rules in the brief and PRODUCT.md
 * ("common practice, no source").
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Role } from "@/lib/access/roles";
import { createSmtpMailer } from "@/lib/server/mail";
import { database } from "@/lib/server/services";
import { call, discoverRoutes, type Method } from "../support/api";
import { DEAD_PORT, startTestStack, type TestStack } from "../support/stack";
import { makePerson, makeWorld, type Person, type World } from "../support/world";
import { discussedUpload } from "./permission-cases/discussions";

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
let uploadId: string;
beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
  uploadId = await discussedUpload(w);
});
afterAll(async () => stack?.close());

const T = "/api/v1/labs/[labId]/threads";
const ONE = `${T}/[threadId]`;
const COMMENTS = `${ONE}/comments`;
const COMMENT = `${COMMENTS}/[commentId]`;

type Caller = Role | Person;
async function api(
  method: Method,
  path: string,
  who: Caller,
  o: { params?: Record<string, string>; json?: unknown; query?: string; labId?: string } = {},
) {
  const token = typeof who === "string" ? w.people[who].token : who.token;
  const res = await call(routes.get(`${method} ${path}`)!, method, path, {
    token,
    params: { labId: o.labId ?? w.labId, ...o.params },
    json: o.json,
    query: o.query,
  });
  return { status: res.status, body: res.status === 204 ? null : await res.json() };
}
const start = (who: Caller, body: string, target: { targetType?: string; targetId?: string } = {}) =>
  api("POST", T, who, { json: { targetType: "upload", targetId: uploadId, body, ...target } });
const reply = (who: Caller, threadId: string, body: string, parentId?: string) =>
  api("POST", COMMENTS, who, { params: { threadId }, json: { body, parentId } });
const getThread = (who: Caller, threadId: string) => api("GET", ONE, who, { params: { threadId } });

async function inbox(email: string): Promise<{ subject: string; text: string }[]> {
  const res = await fetch(`${stack.mailboxUrl}/messages?to=${encodeURIComponent(email)}`);
  return ((await res.json()) as { messages: { subject: string; text: string }[] }).messages;
}

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
      authorEmail: w.people.scientist.email,
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
    expect(resolved.body).toMatchObject({ status: "resolved", resolvedByName: w.people.collaborator.actor.name });
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
      where: { labId: w.labId, targetId: uploadId },
      order: [["createdAt", "asc"]],
    });
    const actions = audit.map((a) => a.action).filter((a) => a.startsWith("discussion.") || a.startsWith("comment."));
    expect(actions).toEqual(
      expect.arrayContaining(["discussion.started", "comment.deleted", "discussion.resolved", "discussion.reopened"]),
    );
    expect(audit.find((a) => a.action === "discussion.resolved")!.summary).toMatch(
      new RegExp(`^${w.people.collaborator.email} resolved a discussion on the file “a.png”`),
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
      where: { labId: w.labId, action: "comment.deleted" },
      order: [["createdAt", "desc"]],
    });
    expect(entry!.summary).toBe(
      `${w.people.manager.email} deleted a comment by ${w.people.scientist.email} on ${t.body.thread.target.label}`,
    );
  });

  it("answers 404 for another lab's thread, a target outside the lab, and fits (no fits yet)", async () => {
    const t = await start("scientist", "Lab-internal note.");
    const threadId = t.body.thread.id;
    // The outsider asks under their own lab, where this thread does not exist.
    const asOutsider = { labId: w.otherLabId, params: { threadId } };
    expect((await api("GET", ONE, w.outsider, asOutsider)).status).toBe(404);
    expect((await api("POST", COMMENTS, w.outsider, { ...asOutsider, json: { body: "hi" } })).status).toBe(404);
    expect((await api("PATCH", ONE, w.outsider, { ...asOutsider, json: { status: "resolved" } })).status).toBe(404);
    expect(
      (
        await api("DELETE", COMMENT, w.outsider, {
          labId: w.otherLabId,
          params: { threadId, commentId: t.body.comment.id },
        })
      ).status,
    ).toBe(404);
    const foreignTarget = await api("POST", T, w.outsider, {
      labId: w.otherLabId,
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

describe("sanitised bodies", () => {
  // Common XSS vectors (OWASP XSS filter evasion cheat sheet, from memory).
  const ATTACKS = [
    { name: "script tag", body: "hello <script>alert(1)</script> there" },
    { name: "img onerror", body: `<img src=x onerror="alert(1)"> look` },
    { name: "javascript: markdown link", body: "[x](javascript:alert(1))" },
    {
      name: "event handler on an allowed tag",
      body: `<a href="https://example.org" onclick="alert(1)">ok</a> <strong onmouseover="alert(1)">b</strong>`,
    },
    { name: "encoded javascript: URL", body: `<a href="jav&#x09;ascript:alert(1)">y</a> [z](JaVaScRiPt:alert(1))` },
  ];
  for (const a of ATTACKS) {
    it(`strips the ${a.name}`, async () => {
      const res = await start("collaborator", a.body);
      expect(res.status).toBe(201);
      const html = res.body.comment.bodyHtml as string;
      expect(html).not.toMatch(/<script|<img|onerror|onclick|onmouseover|javascript:|alert\(1\)<\/script/i);
      expect(res.body.comment.body).toBe(a.body.trim());
    });
  }
  it("keeps the safe subset: emphasis, code, lists, quotes and http links (with rel=nofollow)", async () => {
    const res = await start(
      "collaborator",
      "*a* `k*` \n\n- one\n- two\n\n> quoted\n\n[paper](https://doi.org/10.1000/x)",
    );
    const html = res.body.comment.bodyHtml as string;
    expect(html).toContain("<em>a</em>");
    expect(html).toContain("<code>k*</code>");
    expect(html).toContain("<li>one</li>");
    expect(html).toContain("<blockquote>");
    expect(html).toContain(`<a href="https://doi.org/10.1000/x" rel="nofollow noopener noreferrer">paper</a>`);
  });
});

describe("mentions and e-mail", () => {
  it("e-mails exactly the mentioned members, then the participants, never the author or non-members", async () => {
    const author = await makePerson("scientist", w.labId, "mention-author");
    const byName = await makePerson("modeller", w.labId, "mention-name");
    const byEmail = await makePerson("collaborator", w.labId, "mention-mail");
    const bystander = await makePerson("scientist", w.labId, "mention-bystander");
    const body = `@"${byName.actor.name}" and @${byEmail.email}: is this 40 µm? cc @${w.outsider.email} @nobody@else.test @${author.email}`;
    const res = await start(author, body);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ notified: true, recipients: 2 });
    expect(res.body.comment.mentions.map((x: { userId: string }) => x.userId).sort()).toEqual(
      [byName.userId, byEmail.userId, author.userId].sort(),
    );
    const m = await database();
    expect((await m.Comment.findByPk(res.body.comment.id))!.mentions.sort()).toEqual(
      [byName.userId, byEmail.userId, author.userId].sort(),
    );

    for (const p of [byName, byEmail]) {
      const mail = await inbox(p.email);
      expect(mail).toHaveLength(1);
      expect(mail[0].subject).toBe(`[Test Lab] ${author.actor.name} mentioned you on ${res.body.thread.target.label}`);
      expect(mail[0].text).toContain(body);
      expect(mail[0].text).toContain(`http://127.0.0.1:3999/labs/${w.labId}/specimens/`);
      expect(mail[0].text).toContain(`?discuss=${uploadId}#discussion`);
    }
    for (const p of [author, bystander, w.outsider]) expect(await inbox(p.email)).toHaveLength(0);

    // A reply by someone else: the participant (the author) hears; the mentioned people do not.
    const r = await reply(bystander, res.body.thread.id, "It is 41 µm on my count.");
    expect(r.body).toMatchObject({ notified: true, recipients: 1 });
    const got = await inbox(author.email);
    expect(got).toHaveLength(1);
    expect(got[0].subject).toBe(`[Test Lab] ${bystander.actor.name} commented on ${res.body.thread.target.label}`);
    expect(await inbox(byName.email)).toHaveLength(1);
    expect(await inbox(bystander.email)).toHaveLength(0);

    // An edit that adds a mention e-mails only the newly mentioned member.
    const late = await makePerson("modeller", w.labId, "mention-late");
    const e = await api("PATCH", COMMENT, bystander, {
      params: { threadId: res.body.thread.id, commentId: r.body.comment.id },
      json: { body: `It is 41 µm; @"${late.actor.name}" agrees?` },
    });
    expect(e.body).toMatchObject({ notified: true, recipients: 1 });
    expect(await inbox(late.email)).toHaveLength(1);
    expect(await inbox(author.email)).toHaveLength(1);
  });

  it("respects notifyByEmail = false", async () => {
    const author = await makePerson("scientist", w.labId, "quiet-author");
    const quiet = await makePerson("collaborator", w.labId, "quiet");
    const loud = await makePerson("modeller", w.labId, "loud");
    const m = await database();
    await m.User.update({ notifyByEmail: false }, { where: { id: quiet.userId } });
    const res = await start(author, `@${quiet.email} @${loud.email} please check`);
    expect(res.body).toMatchObject({ notified: true, recipients: 1 });
    expect(await inbox(quiet.email)).toHaveLength(0);
    expect(await inbox(loud.email)).toHaveLength(1);
  });

  it("saves the comment and answers notified: false with a reason when the mail server is down", async () => {
    const author = await makePerson("scientist", w.labId, "down-author");
    const target = await makePerson("modeller", w.labId, "down-target");
    const working = stack.services.mailer;
    // Nothing listens on DEAD_PORT: the SMTP connection is refused.
    stack.services.mailer = createSmtpMailer({
      url: `smtp://127.0.0.1:${DEAD_PORT}`,
      from: "Morphokin <noreply@morphokin.test>",
    });
    try {
      const res = await start(author, `@${target.email} the mail server is down`);
      expect(res.status).toBe(201);
      expect(res.body.notified).toBe(false);
      expect(res.body.recipients).toBe(0);
      expect(res.body.reason).toBe(
        "the mail server could not be reached or refused the message; the comment is saved but 1 of 1 notification e-mail(s) were not sent",
      );
      const saved = await getThread("scientist", res.body.thread.id);
      expect(saved.body.comments[0].body).toBe(`@${target.email} the mail server is down`);
    } finally {
      stack.services.mailer = working;
    }
    expect(await inbox(target.email)).toHaveLength(0);
  });
});
