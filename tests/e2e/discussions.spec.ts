/**
 * A discussion about a seeded readout: the collaborator asks and mentions the bench scientist, the
 * scientist gets the e-mail (fake mailbox), follows its link, replies from the dashboard with the
 * "@" hint, the collaborator hears back and resolves the thread.
 *
 * The thread is started through the same API call the Discussion component makes: the readout
 * page belongs to another area and embeds `<Discussion>` when its owner adds it.
 */
import { expect, test, type Page } from "@playwright/test";
import { BASE_URL, DEMO, DEMO_LAB, unique } from "./support/demo";
import { linkTo, mailIds, waitForMail } from "./support/mailbox";
import { signIn } from "./support/session";

const COLLABORATOR_NAME = "Sami Oduya"; // lib/cli/seed-demo.ts DEMO_PEOPLE, written out on purpose
const SCIENTIST_NAME = "Teodor Varga";

function threadOnDashboard(page: Page, text: string) {
  return page.getByTestId("open-discussion").filter({ hasText: text });
}

test("collaborator asks about a readout, the scientist is e-mailed and replies, the collaborator resolves", async ({
  page,
  browser,
}) => {
  const labId = await signIn(page, DEMO.collaborator.email);
  const readouts = await (
    await page.request.get(`/api/v1/labs/${labId}/readouts?pageSize=1&sort=createdAt&dir=asc`)
  ).json();
  const readout = readouts.items[0] as { id: string; filename: string };
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

  await page.goto(`/labs/${labId}`);
  const row = threadOnDashboard(page, question);
  await expect(row).toContainText(`the readout of “${readout.filename}”`);
  await expect(row).toContainText(COLLABORATOR_NAME);

  // The scientist's mail names the lab and the readout, carries the text and a link to the readout.
  const mail = await waitForMail(DEMO.scientist.email, seenByScientist);
  expect(mail.subject).toBe(`[${DEMO_LAB}] ${COLLABORATOR_NAME} mentioned you on the readout of “${readout.filename}”`);
  expect(mail.text).toContain(question);
  expect(linkTo(mail, `/labs/${labId}/readouts/`)).toBe(`${BASE_URL}/labs/${labId}/readouts/${readout.id}`);

  const scientistContext = await browser.newContext();
  const sp = await scientistContext.newPage();
  await signIn(sp, DEMO.scientist.email);
  await sp.goto(linkTo(mail, `/labs/${labId}/readouts/`));
  await expect(sp.getByRole("heading", { level: 1 })).toHaveText(`Readout of ${readout.filename}`);

  // Reply from the dashboard, mentioning the collaborator through the "@" hint.
  const seenByCollaborator = await mailIds(DEMO.collaborator.email);
  await sp.goto(`/labs/${labId}`);
  await threadOnDashboard(sp, question).getByTestId("open-thread").click();
  const thread = sp.getByTestId("thread");
  await expect(thread.getByTestId("comment-body").first()).toContainText(question);
  await thread.getByTestId("reply-toggle").first().click();
  const replyBox = thread.getByTestId("reply-box-text");
  await replyBox.pressSequentially("Thanks @Sam");
  await expect(sp.getByTestId("mention-hint")).toContainText(COLLABORATOR_NAME);
  await sp
    .getByTestId("mention-hint")
    .getByRole("button", { name: new RegExp(COLLABORATOR_NAME) })
    .click();
  await replyBox.pressSequentially("it is 38 µm in the control, 31 µm under the inhibitor.");
  await expect(replyBox).toHaveValue(
    `Thanks @"${COLLABORATOR_NAME}" it is 38 µm in the control, 31 µm under the inhibitor.`,
  );
  await thread.getByTestId("reply-box-submit").click();
  await expect(sp.getByTestId("discussion-notice")).toHaveText("Saved; 1 person was notified by e-mail.");
  await expect(thread.getByTestId("comment")).toHaveCount(2);
  await expect(thread.getByTestId("comment").nth(1)).toContainText(SCIENTIST_NAME);
  await expect(thread.getByTestId("comment").nth(1).getByTestId("comment-body")).toHaveText(
    `Thanks @"${COLLABORATOR_NAME}" it is 38 µm in the control, 31 µm under the inhibitor.`,
  );
  await scientistContext.close();

  const reply = await waitForMail(DEMO.collaborator.email, seenByCollaborator);
  expect(reply.subject).toBe(`[${DEMO_LAB}] ${SCIENTIST_NAME} mentioned you on the readout of “${readout.filename}”`);

  // The collaborator resolves it; it leaves the open list.
  await page.reload();
  await threadOnDashboard(page, question).getByTestId("open-thread").click();
  const mine = page.getByTestId("thread");
  await expect(mine.getByTestId("comment")).toHaveCount(2);
  await expect(mine.getByTestId("comment").first().getByTestId("edit-comment")).toBeVisible();
  await expect(mine.getByTestId("comment").nth(1).getByTestId("edit-comment")).toHaveCount(0);
  await mine.getByTestId("resolve-thread").click();
  await expect(mine).toHaveAttribute("data-status", "resolved");
  await expect(mine.getByTestId("resolved-by")).toContainText(`resolved by ${COLLABORATOR_NAME}`);
  await page.getByTestId("close-thread").click();
  await expect(threadOnDashboard(page, question)).toHaveCount(0);
});
