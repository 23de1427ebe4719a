import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { ANSWER, newMember, QUESTION, sessionUser, setupQaDb, trustedMember, type QaTestDb } from "./setup";

// Rate limits kept in PostgreSQL: a fixed-window counter advanced by one atomic upsert, so separate
// connections (as separate app instances would hold) can never let more through than the limit.
// Numbers from the issue 6 brief: 10 posts (questions and answers together) per member per hour.
// 429 Too Many Requests and its Retry-After: RFC 6585 §4, RFC 9110 §10.2.3.

let t: QaTestDb;
beforeAll(async () => {
  t = await setupQaDb("qa_rate_limits");
});
afterAll(async () => {
  await t.teardown();
});

describe("the posting limit", () => {
  it("takes 10 questions and answers in the hour and refuses the 11th with when to try again", async () => {
    const { askQuestion, answerQuestion } = await import("@/lib/qa/posting");
    const member = await sessionUser((await newMember(t.pool, "Busy Poster")).id);
    const asker = await trustedMember(t.pool, "Patient Asker");
    const { rows } = await t.pool.query("insert into questions (author_id, title, body_md, state) values ($1, 'Open question', 'A question open for answers, long enough.', 'visible') returning id", [asker.id]);
    for (let i = 0; i < 6; i++) expect(await askQuestion(member, { ...QUESTION, title: `${QUESTION.title} #${i}` }), `question ${i}`).toMatchObject({ ok: true });
    for (let i = 0; i < 4; i++) expect(await answerQuestion(member, rows[0].id, ANSWER), `answer ${i}`).toMatchObject({ ok: true });
    const eleventh = await askQuestion(member, QUESTION);
    expect(eleventh).toMatchObject({ ok: false, status: 429 });
    if (eleventh.ok) throw new Error("posted");
    expect(eleventh.message).toMatch(/You can post again in \d+ (minutes|seconds) \(at \d\d:00 UTC\)\./);
    expect(eleventh.retryAfterSeconds).toBeGreaterThan(0);
    expect(eleventh.retryAfterSeconds).toBeLessThanOrEqual(3600);
    const count = await t.pool.query("select count(*)::int as n from questions where author_id = $1", [member.id]);
    expect(count.rows[0].n).toBe(6);
    // The refused post rolled back its own hit: the window still reads 10.
    const window = await t.pool.query("select count from rate_limits where key = $1", [`qa:post:${member.id}`]);
    expect(window.rows).toEqual([{ count: 10 }]);
  });

  it("lets exactly 10 of 14 simultaneous posts through", async () => {
    const { askQuestion } = await import("@/lib/qa/posting");
    const member = await sessionUser((await newMember(t.pool, "Flood Poster")).id);
    const results = await Promise.all(Array.from({ length: 14 }, (_, i) => askQuestion(member, { ...QUESTION, title: `${QUESTION.title} @${i}` })));
    expect(results.filter((r) => r.ok)).toHaveLength(10);
    expect(results.filter((r) => !r.ok && r.status === 429)).toHaveLength(4);
    const count = await t.pool.query("select count(*)::int as n from questions where author_id = $1", [member.id]);
    expect(count.rows[0].n).toBe(10);
  });

  it("does not count a refused input against the budget", async () => {
    const { askQuestion } = await import("@/lib/qa/posting");
    const member = await sessionUser((await newMember(t.pool, "Careless Poster")).id);
    expect(await askQuestion(member, { title: "Help", bodyMd: "x" })).toMatchObject({ ok: false, status: 422 });
    expect(await askQuestion(member, { ...QUESTION, listingId: "00000000-0000-4000-8000-000000000000" })).toMatchObject({ ok: false, status: 422 });
    const window = await t.pool.query("select count from rate_limits where key = $1", [`qa:post:${member.id}`]);
    expect(window.rows).toEqual([]);
  });
});

describe("consumeRateLimit across connections", () => {
  it("two transactions on two connections, one hit left: exactly one is allowed", async () => {
    const { consumeRateLimit } = await import("@/lib/rate-limit");
    const rule = { key: `test:parallel:${Date.now()}`, limit: 10, windowSeconds: 3600 };
    for (let i = 0; i < 9; i++) expect((await consumeRateLimit(rule)).allowed).toBe(true);
    const clients = [new pg.Client({ connectionString: t.url }), new pg.Client({ connectionString: t.url })];
    await Promise.all(clients.map((c) => c.connect()));
    try {
      const decisions = await Promise.all(
        clients.map((client) =>
          drizzle(client).transaction(async (tx) => consumeRateLimit(rule, { executor: tx as never })),
        ),
      );
      expect(decisions.map((d) => d.allowed).sort()).toEqual([false, true]);
      expect(decisions.map((d) => d.count).sort()).toEqual([10, 11]);
    } finally {
      await Promise.all(clients.map((c) => c.end()));
    }
  });

  it("starts a window on the hour (epoch-aligned, POSIX time has 86 400 s a day) and counts each window apart", async () => {
    const { consumeRateLimit } = await import("@/lib/rate-limit");
    const rule = { key: `test:windows:${Date.now()}`, limit: 2, windowSeconds: 3600 };
    const at = (iso: string) => ({ now: new Date(iso) });
    expect(await consumeRateLimit(rule, at("2025-03-01T13:47:12Z"))).toMatchObject({ allowed: true, count: 1, retryAfterSeconds: 768 });
    expect(await consumeRateLimit(rule, at("2025-03-01T13:59:59Z"))).toMatchObject({ allowed: true, count: 2 });
    const third = await consumeRateLimit(rule, at("2025-03-01T13:59:59Z"));
    expect(third).toMatchObject({ allowed: false, count: 3, retryAfterSeconds: 1 });
    expect(third.resetAt.toISOString()).toBe("2025-03-01T14:00:00.000Z");
    expect(await consumeRateLimit(rule, at("2025-03-01T14:00:00Z"))).toMatchObject({ allowed: true, count: 1 });
    const { rows } = await t.pool.query("select window_start, count from rate_limits where key = $1 order by window_start", [rule.key]);
    expect(rows.map((r) => [new Date(r.window_start).toISOString(), r.count])).toEqual([
      ["2025-03-01T13:00:00.000Z", 3],
      ["2025-03-01T14:00:00.000Z", 1],
    ]);
  });
});

describe("the flagging limit", () => {
  it("refuses the 21st flag in the hour with 429 and leaves no flag behind", async () => {
    const { flagPost } = await import("@/lib/qa/moderation");
    const flagger = await sessionUser((await newMember(t.pool, "Eager Flagger")).id);
    const author = await trustedMember(t.pool, "Prolific Author");
    const ids: string[] = [];
    for (let i = 0; i < 21; i++) {
      const { rows } = await t.pool.query("insert into questions (author_id, title, body_md, state) values ($1, $2, 'Some text that is long enough.', 'visible') returning id", [author.id, `Question ${i}`]);
      ids.push(rows[0].id);
    }
    for (const id of ids.slice(0, 20)) expect(await flagPost(flagger, "question", id, { reason: "Duplicate." })).toMatchObject({ ok: true });
    expect(await flagPost(flagger, "question", ids[20]!, { reason: "Duplicate." })).toMatchObject({ ok: false, status: 429 });
    const { rows } = await t.pool.query("select count(*)::int as n from post_flags where post_id = $1", [ids[20]]);
    expect(rows[0].n).toBe(0);
  });
});
