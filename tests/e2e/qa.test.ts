import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from "vitest";
import pg from "pg";
import { plainPng } from "../support/files";
import { openBrowser, screenshot, type Session } from "./support/browser";
import { waitForMessage } from "./support/outbox";
import { signInThroughOutbox } from "./support/sign-in";

// The moderated Q&A in Chromium against the production build: a new member's question waits for a
// moderator (and a visitor cannot see it), the moderator approves it in the queue, another member
// answers and the asker gets the e-mail, members flag the answer until it is hidden, the moderator
// restores it, and the asker accepts it. Hostile Markdown in the question must stay inert in the page.

const MODERATOR = "sefa.moderator@larkspur.test";
const ANSWERER = "noor.builds@larkspur.test";
const FLAGGER = "tamsin.reviews@larkspur.test";
const KIT_ID = "0b7d1c3e-5a21-4c6e-9f10-000000000001";
const run = Date.now().toString(36);
const ASKER = `quill.firstbuild.${run}@larkspur.test`;
const TITLE = `Bus sits 20 V low through the series lamp (${run})`;
const BODY = [
  "With the **100 W lamp** in series the bus settles at 305 V DC; the sheet expects about 325 V.",
  "<script>window.__qaInjected = 'script'</script>",
  '<img src="x" onerror="window.__qaInjected = \'onerror\'">',
  "[open the scope capture](javascript:window.__qaInjected='link')",
].join("\n\n");

let pool: pg.Pool;
const state: { questionId?: string; answerId?: string } = {};

/** Later steps build on earlier ones; say so plainly instead of timing out on an id of "undefined". */
function needed(key: keyof typeof state): string {
  const value = state[key];
  if (!value) throw new Error(`an earlier step did not leave a ${key}`);
  return value;
}

async function dbState(table: "questions" | "answers", id: string): Promise<string> {
  const { rows } = await pool.query(`select state from ${table} where id = $1`, [id]);
  return rows[0]?.state;
}

beforeAll(async () => {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) throw new Error("E2E_DATABASE_URL is not set: run this through `npm test -- --e2e-only tests/e2e/qa.test.ts`");
  pool = new pg.Pool({ connectionString: url, max: 2 });
  // The answering builder has two approved questions already, so her answer is up at once.
  for (const n of [1, 2]) {
    await pool.query("insert into questions (author_id, title, body_md, state) values ('demo-builder', $1, $2, 'visible')", [
      `Earlier question ${n} (${run})`,
      "An earlier question of hers that a moderator approved.",
    ]);
  }
});

afterAll(async () => {
  await pool?.end();
});

describe("the moderated Q&A in Chromium", () => {
  let s: Session;
  beforeEach(async () => {
    s = await openBrowser();
  });
  afterEach(async () => {
    await s.close();
  });

  it("a new member asks a question with a photo; it waits for a moderator and a visitor cannot see it", async () => {
    const page = s.page;
    await signInThroughOutbox(page, ASKER, `/questions/new?listing=${KIT_ID}`);
    await page.goto(`/questions/new?listing=${KIT_ID}`);
    await page.getByTestId("ask-form").waitFor();
    expect(await page.getByText("A moderator reads it first").count()).toBe(1);
    // Arriving from the kit's page, the question is about that kit.
    expect(await page.getByLabel("About").inputValue()).toBe(KIT_ID);
    await page.getByRole("textbox", { name: "Question", exact: true }).fill(TITLE);
    await page.getByLabel("Details").fill(BODY);
    await page.getByLabel("Add photos to photos").setInputFiles([{ name: "bus-reading.png", mimeType: "image/png", buffer: await plainPng({ width: 640, height: 400 }) }]);
    await expect.poll(() => page.getByTestId("uploaded-photo").count(), { timeout: 60_000 }).toBe(1);
    await screenshot(page, "qa-ask-form");
    await page.getByRole("button", { name: "Post the question" }).click();
    await page.waitForURL(/\/questions\/[0-9a-f-]{36}\?posted=pending/);
    state.questionId = /\/questions\/([0-9a-f-]{36})/.exec(page.url())![1];
    expect(await page.getByTestId("question-state-note").textContent()).toContain("Waiting for a moderator");
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(TITLE);
    expect(await page.getByTestId("question-body").locator("img").count()).toBe(1);
    await screenshot(page, "qa-question-pending");
    expect(await dbState("questions", state.questionId!)).toBe("pending");

    const visitor = await openBrowser();
    try {
      await visitor.page.goto(`/questions/${state.questionId}`);
      await visitor.page.getByRole("heading", { name: "No such question" }).waitFor();
      expect(await visitor.page.locator("body").textContent()).not.toContain(TITLE);
      expect((await visitor.page.request.get(`/api/questions/${state.questionId}`)).status()).toBe(404);
      await visitor.page.goto("/questions");
      // The list has the answering builder's earlier questions in it, so it is there once loaded.
      await visitor.page.getByTestId("question-list").waitFor();
      expect(await visitor.page.getByTestId("question-list").textContent()).toContain(`Earlier question 1 (${run})`);
      expect(await visitor.page.locator("body").textContent()).not.toContain(TITLE);
      await screenshot(visitor.page, "qa-visitor-list-before-approval");
    } finally {
      await visitor.close();
    }
  });

  it("the moderator approves it in the queue and it becomes visible, inert Markdown and all", async () => {
    const id = needed("questionId");
    const page = s.page;
    await signInThroughOutbox(page, MODERATOR, "/moderate/posts");
    await page.goto("/moderate/posts");
    const item = page.getByTestId(`queue-post-${id}`);
    await item.waitFor();
    expect(await item.textContent()).toContain(TITLE);
    expect(await item.textContent()).toContain(ASKER);
    await screenshot(page, "qa-moderation-queue");
    await item.getByRole("button", { name: "Approve the question" }).click();
    await item.waitFor({ state: "detached" });
    expect(await dbState("questions", id)).toBe("visible");
    const { rows } = await pool.query("select actor_id, action from audit_log where subject_id = $1", [id]);
    expect(rows).toEqual([{ actor_id: "demo-moderator", action: "question.approved" }]);

    const visitor = await openBrowser();
    try {
      await visitor.page.goto("/questions");
      await visitor.page.getByRole("link", { name: TITLE }).click();
      await visitor.page.getByTestId("question-page").waitFor();
      const body = visitor.page.getByTestId("question-body");
      expect(await body.textContent()).toContain("305 V DC");
      expect(await body.locator("script").count()).toBe(0);
      expect(await body.locator("[onerror]").count()).toBe(0);
      expect(await body.locator("a[href^='javascript']").count()).toBe(0);
      expect(await visitor.page.evaluate(() => (window as unknown as { __qaInjected?: string }).__qaInjected)).toBeUndefined();
      expect(await visitor.page.getByText("to answer, vote or flag a post").count()).toBe(1);
      await screenshot(visitor.page, "qa-question-visible");
    } finally {
      await visitor.close();
    }
  });

  it("another member answers and the asker gets the e-mail", async () => {
    const id = needed("questionId");
    const page = s.page;
    await signInThroughOutbox(page, ANSWERER, `/questions/${id}`);
    await page.goto(`/questions/${id}`);
    const since = new Date(Date.now() - 1000);
    await page.getByRole("textbox", { name: "Your answer" }).fill("The lamp drops voltage while the bus capacitors draw current; 305 V at idle is normal. Check the idle input current next.");
    await page.getByRole("button", { name: "Post the answer" }).click();
    await page.waitForURL(/answered=visible/);
    const answer = page.getByTestId("answer").first();
    await answer.waitFor();
    state.answerId = (await answer.getAttribute("id"))!.replace("answer-", "");
    expect(await answer.getAttribute("data-state")).toBe("visible");
    expect(await answer.textContent()).toContain("You answered");
    await screenshot(page, "qa-answered");

    const mail = await waitForMessage(ASKER, since, 30_000, "New answer");
    expect(mail.subject).toBe(`New answer: “${TITLE}”`);
    expect(mail.text).toContain("Noor Delacroix-Haidari answered");
    expect(mail.html).toContain(`/questions/${id}#answer-${state.answerId}`);
  });

  it("the third flag hides the answer; the moderator restores it, and the asker accepts it", async () => {
    const id = needed("questionId");
    const answerId = needed("answerId");
    // Two members flagged it already; the reviewer's flag through the page is the third.
    for (const flagger of ["demo-seller-kits", "demo-seller-magnetics"]) {
      await pool.query("insert into post_flags (post_kind, post_id, flagger_id, reason) values ('answer', $1, $2, 'Reads like a guess.')", [answerId, flagger]);
    }
    const page = s.page;
    await signInThroughOutbox(page, FLAGGER, `/questions/${id}`);
    await page.goto(`/questions/${id}`);
    const answer = page.locator(`#answer-${answerId}`);
    await answer.getByText("Flag this answer for a moderator").click();
    await answer.getByLabel("What is wrong with it?").fill("Says 305 V is normal without asking about the lamp wattage.");
    await answer.getByRole("button", { name: "Flag it" }).click();
    await page.waitForURL(/flagged=hidden/);
    expect(await page.getByRole("status").filter({ hasText: "Thank you for flagging" }).textContent()).toContain("now hidden until a moderator reviews it");
    expect(await dbState("answers", answerId)).toBe("hidden");
    // Hidden from everyone but its author and the moderators.
    expect(await page.locator(`#answer-${answerId}`).count()).toBe(0);
    await screenshot(page, "qa-flagged");

    const moderator = await openBrowser();
    try {
      await signInThroughOutbox(moderator.page, MODERATOR, "/moderate/posts");
      await moderator.page.goto("/moderate/posts");
      const item = moderator.page.getByTestId(`queue-post-${answerId}`);
      await item.waitFor();
      expect(await item.textContent()).toContain("Hidden pending review");
      expect(await item.textContent()).toContain("3 open flags");
      expect(await item.getByTestId("queue-flags").textContent()).toContain("without asking about the lamp wattage");
      await screenshot(moderator.page, "qa-moderation-flagged");
      await item.getByRole("button", { name: "Restore the answer" }).click();
      await item.waitFor({ state: "detached" });
    } finally {
      await moderator.close();
    }
    expect(await dbState("answers", answerId)).toBe("visible");
    const { rows } = await pool.query("select count(*)::int as open from post_flags where post_id = $1 and resolved_at is null", [answerId]);
    expect(rows[0].open).toBe(0);

    const asker = await openBrowser();
    try {
      await signInThroughOutbox(asker.page, ASKER, `/questions/${id}`);
      await asker.page.goto(`/questions/${id}`);
      const restored = asker.page.locator(`#answer-${answerId}`);
      await restored.getByRole("button", { name: "Vote up" }).click();
      await expect.poll(() => restored.getByTestId("answer-score").textContent()).toBe("1");
      await restored.getByRole("button", { name: "Accept this answer" }).click();
      await expect.poll(() => restored.getAttribute("data-accepted")).toBe("true");
      expect(await restored.textContent()).toContain("Accepted answer");
      await screenshot(asker.page, "qa-accepted");
    } finally {
      await asker.close();
    }
  });
});
