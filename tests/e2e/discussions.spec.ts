/**
 * A discussion about a seeded readout: the collaborator asks and mentions the bench scientist, the
 * scientist gets the e-mail (fake mailbox), follows its link, replies from the dashboard with the
 * "@" hint, the collaborator hears back and resolves the thread.
 *
 * The thread is started through the same API call the Discussion component makes: the readout
 * page belongs to another area and embeds `<Discussion>` when its owner adds it.
 */
import { BASE_URL, DEMO, DEMO_LAB, unique } from "./support/demo";
import { linkTo, mailIds, waitForMail } from "./support/mailbox";
import type { Page } from "@playwright/test";
import { expect, test } from "./pages/fixtures";
import { DashboardPage } from "./pages/dashboard-page";
import { DiscussionPanel } from "./pages/discussion-panel";
import { ReadoutPage } from "./pages/readout-page";

const COLLABORATOR_NAME = "Sami Oduya"; // lib/cli/seed-demo.ts DEMO_PEOPLE, written out on purpose
const SCIENTIST_NAME = "Teodor Varga";

test.use({ role: "collaborator" });

/** The lab's oldest readout (a seeded one), for a thread to be about. */
async function firstReadout(page: Page, labId: string): Promise<{ id: string; filename: string }> {
  const readouts = await (
    await page.request.get(`/api/v1/labs/${labId}/readouts?pageSize=1&sort=createdAt&dir=asc`)
  ).json();
  return readouts.items[0] as { id: string; filename: string };
}

/** Starts a thread on the lab's first readout with `${question}?`, as the Discussion component would. */
async function startThreadOnFirstReadout(page: Page, labId: string, question: string) {
  const readout = await firstReadout(page, labId);
  const started = await page.request.post(`/api/v1/labs/${labId}/threads`, {
    headers: { origin: BASE_URL },
    data: { targetType: "readout", targetId: readout.id, body: `${question}?` },
  });
  expect(started.status()).toBe(201);
  return readout;
}

test("collaborator asks about a readout, the scientist is e-mailed and replies, the collaborator resolves", async ({
  lab,
  page,
  signInAs,
}) => {
  const labId = lab.labId;
  const readout = await firstReadout(page, labId);
  expect(readout).toBeDefined();

  const question = unique("Is the spacing narrower near the midline");
  const seenByScientist = await mailIds(DEMO.scientist.email);
  // Sent as the page's own fetch would be: with the session cookie and the app's Origin (CSRF check).
  const started = await page.request.post(`/api/v1/labs/${labId}/threads`, {
    headers: { origin: BASE_URL },
    data: { targetType: "readout", targetId: readout.id, body: `@${DEMO.scientist.email} ${question}?` },
  });
  expect(started.status()).toBe(201);
  expect(await started.json()).toMatchObject({ notified: true, recipients: 1 });

  const dashboard = await lab.open(DashboardPage);
  const row = dashboard.thread(question);
  await expect(row).toContainText(`the readout of “${readout.filename}”`);
  await expect(row).toContainText(COLLABORATOR_NAME);

  // The scientist's mail names the lab and the readout, carries the text and a link to the readout.
  const mail = await waitForMail(DEMO.scientist.email, seenByScientist);
  expect(mail.subject).toBe(`[${DEMO_LAB}] ${COLLABORATOR_NAME} mentioned you on the readout of “${readout.filename}”`);
  expect(mail.text).toContain(question);
  expect(linkTo(mail, `/labs/${labId}/readouts/`)).toBe(`${BASE_URL}/labs/${labId}/readouts/${readout.id}`);

  const scientist = await signInAs("scientist");
  const sp = scientist.page;
  await sp.goto(linkTo(mail, `/labs/${labId}/readouts/`));
  await scientist.on(ReadoutPage).expectHeading(`Readout of ${readout.filename}`);

  // Reply from the dashboard, mentioning the collaborator through the "@" hint.
  const seenByCollaborator = await mailIds(DEMO.collaborator.email);
  await (await scientist.open(DashboardPage)).openThread(question);
  const theirs = new DiscussionPanel(sp);
  await expect(theirs.thread.getByTestId("comment-body").first()).toContainText(question);
  await theirs.openReply();
  await theirs.replyBox.pressSequentially("Thanks @Sam");
  await expect(theirs.mentionHint).toContainText(COLLABORATOR_NAME);
  await theirs.pickMention(new RegExp(COLLABORATOR_NAME));
  await theirs.replyBox.pressSequentially("it is 38 µm in the control, 31 µm under the inhibitor.");
  await expect(theirs.replyBox).toHaveValue(
    `Thanks @"${COLLABORATOR_NAME}" it is 38 µm in the control, 31 µm under the inhibitor.`,
  );
  await theirs.sendReply();
  await expect(theirs.notice).toHaveText("Saved; 1 person was notified by e-mail.");
  await expect(theirs.comments).toHaveCount(2);
  await expect(theirs.comments.nth(1)).toContainText(SCIENTIST_NAME);
  await expect(theirs.comments.nth(1).getByTestId("comment-body")).toHaveText(
    `Thanks @"${COLLABORATOR_NAME}" it is 38 µm in the control, 31 µm under the inhibitor.`,
  );
  await sp.context().close();

  const reply = await waitForMail(DEMO.collaborator.email, seenByCollaborator);
  expect(reply.subject).toBe(`[${DEMO_LAB}] ${SCIENTIST_NAME} mentioned you on the readout of “${readout.filename}”`);

  // The collaborator resolves it; it leaves the open list.
  await page.reload();
  await dashboard.openThread(question);
  const mine = new DiscussionPanel(page);
  await expect(mine.comments).toHaveCount(2);
  await expect(mine.comments.first().getByTestId("edit-comment")).toBeVisible();
  await expect(mine.comments.nth(1).getByTestId("edit-comment")).toHaveCount(0);
  await mine.resolve();
  await expect(mine.thread).toHaveAttribute("data-status", "resolved");
  await expect(mine.thread.getByTestId("resolved-by")).toContainText(`resolved by ${COLLABORATOR_NAME}`);
  await mine.close();
  await expect(dashboard.thread(question)).toHaveCount(0);
});

test("on a 390 px phone an open discussion's row keeps its name, first words and counts apart", async ({
  lab,
  page,
}) => {
  const labId = lab.labId;
  const question = unique("Does the row spacing change along the flank");
  const readout = await startThreadOnFirstReadout(page, labId, question);

  await page.setViewportSize({ width: 390, height: 800 });
  const dashboard = await lab.open(DashboardPage);
  const row = dashboard.thread(question);
  await expect(row).toContainText(`the readout of “${readout.filename}”`);
  const name = await row.getByRole("link", { name: `the readout of “${readout.filename}”` }).boundingBox();
  const counts = await row.getByText(/comments?$/).boundingBox();
  const open = await row.getByTestId("open-thread").boundingBox();
  expect(name && counts && open).toBeTruthy();
  // The counts and the Open button sit on their own line below the name, never across it.
  for (const box of [counts!, open!]) {
    const overlaps =
      box.x < name!.x + name!.width &&
      name!.x < box.x + box.width &&
      box.y < name!.y + name!.height &&
      name!.y < box.y + box.height;
    expect(overlaps).toBe(false);
  }
  expect(open!.x + open!.width).toBeLessThanOrEqual(390);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await row.screenshot({ path: "test-results/open-discussions-390.png" });
});

test("a picked mention leaves the caret after it even when the next key comes before the next frame", async ({
  lab,
  page,
}) => {
  const question = unique("Is the third row fainter");
  await startThreadOnFirstReadout(page, lab.labId, question);

  await (await lab.open(DashboardPage)).openThread(question);
  const panel = new DiscussionPanel(page);
  await panel.openReply();
  await panel.replyBox.pressSequentially("Thanks @Sam");
  await expect(panel.mentionHint).toContainText(COLLABORATOR_NAME);

  // Pick the member and type "i" in the same frame: a fast typist's next key can come before the browser
  // paints. React writes the picked text in a microtask after the click; the key lands after that.
  const typed = await page.evaluate(async (name) => {
    const box = document.querySelector<HTMLTextAreaElement>('[data-testid="thread"] [data-testid="reply-box-text"]')!;
    const option = [...document.querySelectorAll<HTMLButtonElement>('[data-testid="mention-hint"] button')].find((b) =>
      b.textContent?.includes(name),
    )!;
    option.click();
    await Promise.resolve();
    const at = box.selectionStart;
    box.setRangeText("i", at, box.selectionEnd, "end");
    box.dispatchEvent(new Event("input", { bubbles: true }));
    // Two frames: anything the pick left for the next frame has run by then.
    await new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done)));
    return { value: box.value, caret: box.selectionStart };
  }, COLLABORATOR_NAME);
  expect(typed.value).toBe(`Thanks @"${COLLABORATOR_NAME}" i`);
  expect(typed.caret).toBe(typed.value.length);

  await panel.replyBox.pressSequentially("t is narrower.");
  await expect(panel.replyBox).toHaveValue(`Thanks @"${COLLABORATOR_NAME}" it is narrower.`);
});
