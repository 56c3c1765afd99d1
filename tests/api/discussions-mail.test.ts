/**
 * Discussions through the route handlers: sanitised bodies, @mentions and the e-mails they cause (read back from the fake SMTP
 * server's mailbox). Expected behaviour is the product rules in the brief and PRODUCT.md
 * ("common practice, no source").
 */
import { describe, expect, it } from "vitest";
import { createSmtpMailer } from "@/lib/server/mail";
import { database } from "@/lib/server/services";
import { discussedUpload } from "./permission-cases/discussions";
import { DEAD_PORT } from "../support/stack";
import { makePerson } from "../support/world";
import { setupLabApi } from "../support/lab-api";
import { COMMENT, discussionCalls } from "../support/discussions";

let uploadId = "";
const lab = setupLabApi({
  setup: async (l) => {
    uploadId = await discussedUpload(l.w);
  },
});
const { api, start, reply, getThread, inbox } = discussionCalls(lab, () => uploadId);

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
    const author = await makePerson("scientist", lab.w.labId, "mention-author");
    const byName = await makePerson("modeller", lab.w.labId, "mention-name");
    const byEmail = await makePerson("collaborator", lab.w.labId, "mention-mail");
    const bystander = await makePerson("scientist", lab.w.labId, "mention-bystander");
    const body = `@"${byName.actor.name}" and @${byEmail.email}: is this 40 µm? cc @${lab.w.outsider.email} @nobody@else.test @${author.email}`;
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
      expect(mail[0].text).toContain(`http://127.0.0.1:3999/labs/${lab.w.labId}/specimens/`);
      expect(mail[0].text).toContain(`?discuss=${uploadId}#discussion`);
    }
    for (const p of [author, bystander, lab.w.outsider]) expect(await inbox(p.email)).toHaveLength(0);

    // A reply by someone else: the participant (the author) hears; the mentioned people do not.
    const r = await reply(bystander, res.body.thread.id, "It is 41 µm on my count.");
    expect(r.body).toMatchObject({ notified: true, recipients: 1 });
    const got = await inbox(author.email);
    expect(got).toHaveLength(1);
    expect(got[0].subject).toBe(`[Test Lab] ${bystander.actor.name} commented on ${res.body.thread.target.label}`);
    expect(await inbox(byName.email)).toHaveLength(1);
    expect(await inbox(bystander.email)).toHaveLength(0);

    // An edit that adds a mention e-mails only the newly mentioned member.
    const late = await makePerson("modeller", lab.w.labId, "mention-late");
    const e = await api("PATCH", COMMENT, bystander, {
      params: { threadId: res.body.thread.id, commentId: r.body.comment.id },
      json: { body: `It is 41 µm; @"${late.actor.name}" agrees?` },
    });
    expect(e.body).toMatchObject({ notified: true, recipients: 1 });
    expect(await inbox(late.email)).toHaveLength(1);
    expect(await inbox(author.email)).toHaveLength(1);
  });

  it("respects notifyByEmail = false", async () => {
    const author = await makePerson("scientist", lab.w.labId, "quiet-author");
    const quiet = await makePerson("collaborator", lab.w.labId, "quiet");
    const loud = await makePerson("modeller", lab.w.labId, "loud");
    const m = await database();
    await m.User.update({ notifyByEmail: false }, { where: { id: quiet.userId } });
    const res = await start(author, `@${quiet.email} @${loud.email} please check`);
    expect(res.body).toMatchObject({ notified: true, recipients: 1 });
    expect(await inbox(quiet.email)).toHaveLength(0);
    expect(await inbox(loud.email)).toHaveLength(1);
  });

  it("saves the comment and answers notified: false with a reason when the mail server is down", async () => {
    const author = await makePerson("scientist", lab.w.labId, "down-author");
    const target = await makePerson("modeller", lab.w.labId, "down-target");
    const working = lab.stack.services.mailer;
    // Nothing listens on DEAD_PORT: the SMTP connection is refused.
    lab.stack.services.mailer = createSmtpMailer({
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
      lab.stack.services.mailer = working;
    }
    expect(await inbox(target.email)).toHaveLength(0);
  });
});
