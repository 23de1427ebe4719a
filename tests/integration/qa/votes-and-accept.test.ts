import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ANSWER, newMember, sessionUser, setupQaDb, trustedMember, type QaTestDb } from "./setup";

// Votes (±1, one per member, not on one's own answer) and the accepted answer (the asker's alone),
// issue 6 "Q&A": the stored score must always equal the sum of the votes, also when votes race.

let t: QaTestDb;
let questionId: string;
let answerId: string;
let asker: { id: string };
let answerer: { id: string };

beforeAll(async () => {
  t = await setupQaDb("qa_votes");
  asker = await trustedMember(t.pool, "Vera Asker");
  answerer = await trustedMember(t.pool, "Otto Answerer");
  const { rows } = await t.pool.query("insert into questions (author_id, title, body_md, state) values ($1, 'Choke hums at idle', 'It hums loudly at no load; the kit sheet says it should be quiet.', 'visible') returning id", [asker.id]);
  questionId = rows[0].id;
  const { answerQuestion } = await import("@/lib/qa/posting");
  const posted = await answerQuestion(await sessionUser(answerer.id), questionId, ANSWER);
  if (!posted.ok) throw new Error(posted.message);
  answerId = posted.id;
});
afterAll(async () => {
  await t.teardown();
});

async function stored(id: string) {
  const { rows } = await t.pool.query("select score, (select coalesce(sum(value), 0)::int from answer_votes where answer_id = $1) as sum, (select count(*)::int from answer_votes where answer_id = $1) as votes from answers where id = $1", [id]);
  return rows[0] as { score: number; sum: number; votes: number };
}

describe("voting", () => {
  it("counts one vote per member: voting up twice is still +1; down replaces it; 0 takes it back", async () => {
    const { voteOnAnswer } = await import("@/lib/qa/votes");
    const voter = await sessionUser((await newMember(t.pool, "Single Voter")).id);
    expect(await voteOnAnswer(voter, answerId, { value: 1 })).toEqual({ ok: true, score: 1, vote: 1 });
    expect(await voteOnAnswer(voter, answerId, { value: 1 })).toEqual({ ok: true, score: 1, vote: 1 });
    expect(await stored(answerId)).toEqual({ score: 1, sum: 1, votes: 1 });
    expect(await voteOnAnswer(voter, answerId, { value: -1 })).toEqual({ ok: true, score: -1, vote: -1 });
    expect(await voteOnAnswer(voter, answerId, { value: 0 })).toEqual({ ok: true, score: 0, vote: 0 });
    expect(await stored(answerId)).toEqual({ score: 0, sum: 0, votes: 0 });
  });

  it("refuses a vote on one's own answer and a vote of 2", async () => {
    const { voteOnAnswer } = await import("@/lib/qa/votes");
    expect(await voteOnAnswer(await sessionUser(answerer.id), answerId, { value: 1 })).toMatchObject({ ok: false, status: 403 });
    expect(await voteOnAnswer(await sessionUser("demo-builder"), answerId, { value: 2 })).toMatchObject({ ok: false, status: 422 });
    expect((await stored(answerId)).score).toBe(0);
  });

  it("keeps the score equal to the sum of the votes when votes arrive at the same instant", async () => {
    const { voteOnAnswer } = await import("@/lib/qa/votes");
    const [a, b] = await Promise.all([newMember(t.pool, "Racer A"), newMember(t.pool, "Racer B")]);
    const [ua, ub] = await Promise.all([sessionUser(a.id), sessionUser(b.id)]);
    // Two members at once: both count.
    const results = await Promise.all([voteOnAnswer(ua, answerId, { value: 1 }), voteOnAnswer(ub, answerId, { value: 1 })]);
    expect(results.every((r) => r.ok)).toBe(true);
    expect(await stored(answerId)).toEqual({ score: 2, sum: 2, votes: 2 });
    // One member twice at once, up and down: one vote survives, and the score agrees with it.
    await Promise.all([voteOnAnswer(ua, answerId, { value: -1 }), voteOnAnswer(ua, answerId, { value: 1 })]);
    const after = await stored(answerId);
    expect(after.votes).toBe(2);
    expect(after.score).toBe(after.sum);
    expect([0, 2]).toContain(after.score);
  });
});

describe("accepting an answer", () => {
  it("is the asker's alone; another member is refused and nothing changes", async () => {
    const { acceptAnswer } = await import("@/lib/qa/votes");
    expect(await acceptAnswer(await sessionUser(answerer.id), questionId, { answerId })).toMatchObject({ ok: false, status: 403 });
    expect(await acceptAnswer(await sessionUser("demo-moderator"), questionId, { answerId })).toMatchObject({ ok: false, status: 403 });
    const { rows } = await t.pool.query("select accepted_answer_id from questions where id = $1", [questionId]);
    expect(rows[0].accepted_answer_id).toBeNull();
    expect(await acceptAnswer(await sessionUser(asker.id), questionId, { answerId })).toEqual({ ok: true, acceptedAnswerId: answerId });
    const after = await t.pool.query("select accepted_answer_id from questions where id = $1", [questionId]);
    expect(after.rows[0].accepted_answer_id).toBe(answerId);
  });

  it("puts the accepted answer first, ahead of a higher score", async () => {
    const { answerQuestion } = await import("@/lib/qa/posting");
    const { voteOnAnswer } = await import("@/lib/qa/votes");
    const { answersForViewer, getQuestionForViewer } = await import("@/db/queries/qa");
    const { orderAnswers } = await import("@/lib/qa/rules");
    const second = await answerQuestion(await sessionUser((await trustedMember(t.pool, "Second Answerer")).id), questionId, { bodyMd: "Check the gap spacer; a loose one hums at twice the switching frequency." });
    if (!second.ok) throw new Error(second.message);
    for (const n of ["V1", "V2", "V3", "V4"]) await voteOnAnswer(await sessionUser((await newMember(t.pool, `Voter ${n}`)).id), second.id, { value: 1 });
    const question = (await getQuestionForViewer(null, questionId))!;
    const ordered = orderAnswers(await answersForViewer(null, question), question.acceptedAnswerId);
    expect(ordered.map((a) => [a.id, a.accepted])).toEqual([
      [answerId, true],
      [second.id, false],
    ]);
    expect(ordered[1]!.score).toBeGreaterThan(ordered[0]!.score);
  });

  it("refuses an answer of another question, and lets the asker take the acceptance back", async () => {
    const { acceptAnswer } = await import("@/lib/qa/votes");
    const { rows } = await t.pool.query("insert into questions (author_id, title, body_md, state) values ($1, 'Another question', 'Another question with enough text.', 'visible') returning id", [asker.id]);
    expect(await acceptAnswer(await sessionUser(asker.id), rows[0].id, { answerId })).toMatchObject({ ok: false, status: 409 });
    expect(await acceptAnswer(await sessionUser(asker.id), questionId, { answerId: null })).toEqual({ ok: true, acceptedAnswerId: null });
  });
});
