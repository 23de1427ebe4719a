import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ANSWER, auditFor, newMember, outboxTo, postState, QUESTION, sessionUser, setupQaDb, trustedMember, type QaTestDb } from "./setup";

// Pre-moderation, flags and the moderator's decisions against the real PostgreSQL, through the same
// functions the server actions and the /api/posts/* routes call. The rules are issue 6's ("a new
// member's first posts wait in a pre-moderation queue; a post with enough flags is hidden pending
// review; moderators approve, remove (with a reason sent to the author) or restore, each with an audit
// entry") with the brief's numbers: fewer than 2 approved posts → pending; 3 open flags → hidden.

let t: QaTestDb;
beforeAll(async () => {
  t = await setupQaDb("qa_moderation");
});
afterAll(async () => {
  await t.teardown();
});

const qa = async () => ({
  ...(await import("@/lib/qa/posting")),
  ...(await import("@/lib/qa/moderation")),
  ...(await import("@/db/queries/qa")),
});

async function visibleQuestion(author: { id: string }) {
  const { rows } = await t.pool.query("insert into questions (author_id, title, body_md, state) values ($1, $2, $3, 'visible') returning id", [
    author.id,
    "Gate drive duty looks short at 40 kHz",
    "The scope shows 38 % duty on the high side; the sheet says 45 %. Probe on the gate resistor.",
  ]);
  return rows[0].id as string;
}

describe("pre-moderation", () => {
  it("a new member's first question waits: only the author and moderators see it; a moderator's approval makes it visible with an audit entry", async () => {
    const { askQuestion, moderatePost, getQuestionForViewer, listQuestions } = await qa();
    const asker = await newMember(t.pool, "Wren Aldous");
    const other = await sessionUser("demo-builder");
    const moderator = await sessionUser("demo-moderator");

    const posted = await askQuestion(await sessionUser(asker.id), QUESTION);
    expect(posted).toMatchObject({ ok: true, state: "pending" });
    if (!posted.ok) throw new Error(posted.message);
    expect(await postState(t.pool, "question", posted.id)).toBe("pending");

    expect(await getQuestionForViewer(null, posted.id)).toBeNull();
    expect(await getQuestionForViewer(other, posted.id)).toBeNull();
    expect((await getQuestionForViewer(await sessionUser(asker.id), posted.id))?.state).toBe("pending");
    expect((await getQuestionForViewer(moderator, posted.id))?.state).toBe("pending");
    expect((await listQuestions(null)).rows.map((r) => r.id)).not.toContain(posted.id);
    expect((await listQuestions(await sessionUser(asker.id))).rows.find((r) => r.id === posted.id)).toMatchObject({ mine: true, state: "pending" });
    const { postQueue } = await import("@/db/queries/qa");
    expect((await postQueue()).pending.map((p) => p.id)).toContain(posted.id);

    expect(await moderatePost(moderator, "question", posted.id, "approve", {})).toMatchObject({ ok: true, from: "pending", to: "visible" });
    expect(await postState(t.pool, "question", posted.id)).toBe("visible");
    expect(await getQuestionForViewer(null, posted.id)).not.toBeNull();
    expect(await auditFor(t.pool, posted.id)).toEqual([
      { actor_id: "demo-moderator", action: "question.approved", subject_type: "question", reason: null, details: { from: "pending", to: "visible", flagsResolved: 0, questionId: posted.id } },
    ]);
    // Approving twice is a conflict, and writes no second entry.
    expect(await moderatePost(moderator, "question", posted.id, "approve", {})).toMatchObject({ ok: false, status: 409 });
    expect(await auditFor(t.pool, posted.id)).toHaveLength(1);
  });

  it("after two approved posts a member's next post is visible at once", async () => {
    const { askQuestion, moderatePost } = await qa();
    const member = await newMember(t.pool, "Ilse Marrow");
    const moderator = await sessionUser("demo-moderator");
    const user = await sessionUser(member.id);
    for (let i = 0; i < 2; i++) {
      const p = await askQuestion(user, { ...QUESTION, title: `${QUESTION.title} (${i + 1})` });
      expect(p).toMatchObject({ ok: true, state: "pending" });
      if (p.ok) await moderatePost(moderator, "question", p.id, "approve", {});
    }
    expect(await askQuestion(user, { ...QUESTION, title: `${QUESTION.title} (3)` })).toMatchObject({ ok: true, state: "visible" });
  });

  it("only a moderator decides, and never on their own post", async () => {
    const { askQuestion, moderatePost } = await qa();
    const member = await newMember(t.pool, "Oskar Penhale");
    const posted = await askQuestion(await sessionUser(member.id), QUESTION);
    if (!posted.ok) throw new Error(posted.message);
    expect(await moderatePost(await sessionUser("demo-builder"), "question", posted.id, "approve", {})).toMatchObject({ ok: false, status: 403 });
    expect(await moderatePost(await sessionUser("demo-moderator"), "question", "00000000-0000-4000-8000-000000000000", "approve", {})).toMatchObject({ ok: false, status: 404 });
    expect(await moderatePost(await sessionUser("demo-moderator"), "comment", posted.id, "approve", {})).toMatchObject({ ok: false, status: 404 });
    expect(await postState(t.pool, "question", posted.id)).toBe("pending");
    expect(await auditFor(t.pool, posted.id)).toEqual([]);
  });
});

describe("flags", () => {
  it("the third open flag hides an answer (audited as the platform's action); the same member cannot flag twice", async () => {
    const { answerQuestion, flagPost, getQuestionForViewer, answersForViewer } = await qa();
    const asker = await trustedMember(t.pool, "Tamar Quist");
    const questionId = await visibleQuestion(asker);
    const answerer = await trustedMember(t.pool, "Bastian Reyes");
    const answer = await answerQuestion(await sessionUser(answerer.id), questionId, ANSWER);
    expect(answer).toMatchObject({ ok: true, state: "visible" });
    if (!answer.ok) throw new Error(answer.message);
    const [a, b, c] = await Promise.all([newMember(t.pool, "Flagger A"), newMember(t.pool, "Flagger B"), newMember(t.pool, "Flagger C")]);

    expect(await flagPost(await sessionUser(a.id), "answer", answer.id, { reason: "Tells people to bridge the input fuse." })).toEqual({ ok: true, openFlags: 1, hidden: false });
    expect(await flagPost(await sessionUser(a.id), "answer", answer.id, { reason: "Flagging again." })).toMatchObject({ ok: false, status: 409 });
    expect(await flagPost(await sessionUser(b.id), "answer", answer.id, { reason: "Unsafe advice." })).toEqual({ ok: true, openFlags: 2, hidden: false });
    expect(await postState(t.pool, "answer", answer.id)).toBe("visible");
    expect(await flagPost(await sessionUser(c.id), "answer", answer.id, { reason: "Dangerous." })).toEqual({ ok: true, openFlags: 3, hidden: true });
    expect(await postState(t.pool, "answer", answer.id)).toBe("hidden");

    const { rows } = await t.pool.query("select count(*)::int as n from post_flags where post_id = $1", [answer.id]);
    expect(rows[0].n).toBe(3);
    expect(await auditFor(t.pool, answer.id)).toMatchObject([{ actor_id: null, action: "answer.hidden", details: { from: "visible", to: "hidden", openFlags: 3, lastFlagBy: c.id } }]);

    // Hidden from visitors and other members; the author still sees it.
    const question = (await getQuestionForViewer(null, questionId))!;
    expect((await answersForViewer(null, question)).map((x) => x.id)).not.toContain(answer.id);
    expect((await answersForViewer(await sessionUser(answerer.id), question)).find((x) => x.id === answer.id)?.state).toBe("hidden");
  });

  it("refuses flags on one's own post, without a reason, and on a post the flagger cannot see", async () => {
    const { askQuestion, flagPost } = await qa();
    const author = await trustedMember(t.pool, "Mira Stone");
    const own = await visibleQuestion(author);
    expect(await flagPost(await sessionUser(author.id), "question", own, { reason: "Mine." })).toMatchObject({ ok: false, status: 403 });
    expect(await flagPost(await sessionUser("demo-builder"), "question", own, { reason: " " })).toMatchObject({ ok: false, status: 422 });
    const fresh = await newMember(t.pool, "Pending Author");
    const pending = await askQuestion(await sessionUser(fresh.id), QUESTION);
    if (!pending.ok) throw new Error(pending.message);
    expect(await flagPost(await sessionUser("demo-builder"), "question", pending.id, { reason: "Spam." })).toMatchObject({ ok: false, status: 404 });
  });

  it("restoring a hidden post resolves its flags: it is visible again and one new flag does not hide it", async () => {
    const { flagPost, moderatePost } = await qa();
    const author = await trustedMember(t.pool, "Juno Harrow");
    const questionId = await visibleQuestion(author);
    const flaggers = await Promise.all(["R1", "R2", "R3"].map((n) => newMember(t.pool, `Reader ${n}`)));
    for (const f of flaggers) await flagPost(await sessionUser(f.id), "question", questionId, { reason: "Looks like an advert." });
    expect(await postState(t.pool, "question", questionId)).toBe("hidden");

    expect(await moderatePost(await sessionUser("demo-moderator"), "question", questionId, "restore", {})).toMatchObject({ ok: true, from: "hidden", to: "visible", flagsResolved: 3 });
    expect(await postState(t.pool, "question", questionId)).toBe("visible");
    const { rows } = await t.pool.query("select count(*)::int as open from post_flags where post_id = $1 and resolved_at is null", [questionId]);
    expect(rows[0].open).toBe(0);
    expect((await auditFor(t.pool, questionId)).map((e) => [e.action, e.actor_id])).toEqual([
      ["question.hidden", null],
      ["question.restored", "demo-moderator"],
    ]);
    // Those who flagged it once cannot flag it again; a new reader's flag starts a fresh count.
    expect(await flagPost(await sessionUser(flaggers[0]!.id), "question", questionId, { reason: "Still an advert." })).toMatchObject({ ok: false, status: 409 });
    const late = await newMember(t.pool, "Reader R4");
    expect(await flagPost(await sessionUser(late.id), "question", questionId, { reason: "Advert." })).toEqual({ ok: true, openFlags: 1, hidden: false });
  });
});

describe("removal", () => {
  it("needs a reason; removes the post, records the reason, resolves flags and queues the author's e-mail in the same transaction", async () => {
    const { flagPost, moderatePost, getQuestionForViewer } = await qa();
    const author = await trustedMember(t.pool, "Ansel Voigt");
    const questionId = await visibleQuestion(author);
    await flagPost(await sessionUser("demo-builder"), "question", questionId, { reason: "Off-topic sales pitch." });
    const moderator = await sessionUser("demo-moderator");

    expect(await moderatePost(moderator, "question", questionId, "remove", {})).toMatchObject({ ok: false, status: 422 });
    expect(await postState(t.pool, "question", questionId)).toBe("visible");
    expect(await outboxTo(t.pool, author.email)).toEqual([]);

    const reason = "Selling parts outside the catalog is not allowed in the Q&A.";
    expect(await moderatePost(moderator, "question", questionId, "remove", { reason })).toMatchObject({ ok: true, to: "removed", flagsResolved: 1 });
    const { rows } = await t.pool.query("select state, removal_reason from questions where id = $1", [questionId]);
    expect(rows[0]).toEqual({ state: "removed", removal_reason: reason });
    expect(await auditFor(t.pool, questionId)).toMatchObject([{ actor_id: "demo-moderator", action: "question.removed", reason, details: { from: "visible", to: "removed", flagsResolved: 1 } }]);
    const mails = await outboxTo(t.pool, author.email);
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ template: "qa-post-removed", props: { kind: "question", reason, authorName: "Ansel Voigt" } });
    expect(String(mails[0]!.props.questionUrl)).toMatch(new RegExp(`/questions/${questionId}$`));

    // Nobody else sees it; the author reads it with the reason.
    expect(await getQuestionForViewer(null, questionId)).toBeNull();
    expect(await getQuestionForViewer(await sessionUser(author.id), questionId)).toMatchObject({ state: "removed", removalReason: reason });
  });

  it("renders the removal e-mail with the reason in it", async () => {
    const { render } = await import("@react-email/render");
    const { postRemovedMail } = await import("@/emails/qa/post-removed");
    const props = { authorName: "Ansel", kind: "answer" as const, questionTitle: "Snubber values", reason: "Advice to defeat the earth bond.", questionUrl: "http://localhost:3000/questions/x" };
    const text = await render(postRemovedMail.template.render(props), { plainText: true });
    expect(postRemovedMail.template.subject(props)).toBe("Removed: your answer to “Snubber values”");
    expect(text).toContain("Advice to defeat the earth bond.");
  });
});

describe("the asker's e-mail when an answer becomes visible", () => {
  it("is queued at once for a trusted member's answer, and only on approval for a pending one; never for answering oneself", async () => {
    const { answerQuestion, moderatePost } = await qa();
    const asker = await trustedMember(t.pool, "Edda Linn");
    const questionId = await visibleQuestion(asker);

    const trusted = await trustedMember(t.pool, "Rafe Okoro");
    expect(await answerQuestion(await sessionUser(trusted.id), questionId, ANSWER)).toMatchObject({ ok: true, state: "visible" });
    expect(await outboxTo(t.pool, asker.email)).toMatchObject([{ template: "qa-answer-posted", props: { answererName: "Rafe Okoro", askerName: "Edda Linn" } }]);

    const fresh = await newMember(t.pool, "Nell Brisk");
    const pending = await answerQuestion(await sessionUser(fresh.id), questionId, ANSWER);
    expect(pending).toMatchObject({ ok: true, state: "pending" });
    if (!pending.ok) throw new Error(pending.message);
    expect(await outboxTo(t.pool, asker.email)).toHaveLength(1);
    await moderatePost(await sessionUser("demo-moderator"), "answer", pending.id, "approve", {});
    expect((await outboxTo(t.pool, asker.email)).map((m) => m.props.answererName)).toEqual(["Rafe Okoro", "Nell Brisk"]);

    await answerQuestion(await sessionUser(asker.id), questionId, { bodyMd: "Update from me: the lamp was a 60 W one, not 100 W." });
    expect(await outboxTo(t.pool, asker.email)).toHaveLength(2);
  });

  it("refuses answers to a question that still waits for a moderator", async () => {
    const { askQuestion, answerQuestion } = await qa();
    const asker = await newMember(t.pool, "Cato Wells");
    const q = await askQuestion(await sessionUser(asker.id), QUESTION);
    if (!q.ok) throw new Error(q.message);
    expect(await answerQuestion(await sessionUser(asker.id), q.id, ANSWER)).toMatchObject({ ok: false, status: 409 });
    expect(await answerQuestion(await sessionUser("demo-builder"), q.id, ANSWER)).toMatchObject({ ok: false, status: 404 });
  });
});
