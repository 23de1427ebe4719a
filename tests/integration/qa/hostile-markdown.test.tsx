import { renderToStaticMarkup } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sessionUser, setupQaDb, trustedMember, type QaTestDb } from "./setup";
import { tags, tagsNamed } from "../../unit/ui/html";

// Text people post is stored as typed and made inert where it is shown: a question and an answer
// carrying the usual attacks (OWASP XSS Filter Evasion Cheat Sheet: <script>, javascript: links,
// <img onerror>, an image from a foreign host) go into the database through the posting functions,
// are read back through the page's queries and rendered with the page's own components.

let t: QaTestDb;
beforeAll(async () => {
  t = await setupQaDb("qa_markdown");
});
afterAll(async () => {
  await t.teardown();
});

const HOSTILE = [
  "Before the attack.",
  "<script>alert('question')</script>",
  "[press here](javascript:alert(document.cookie))",
  '<img src="x" onerror="alert(1)">',
  "![foreign](https://tracker.elsewhere.example/pixel.png)",
  "![from the uploads host](http://127.0.0.1:4030/f/bench.webp)",
  "After the attack: **bold** stays.",
].join("\n\n");

describe("hostile Markdown in posts", () => {
  it("is stored as typed, and the question page's components render it inert", async () => {
    const { askQuestion, answerQuestion } = await import("@/lib/qa/posting");
    const { getQuestionForViewer, answersForViewer } = await import("@/db/queries/qa");
    const { PostBody } = await import("@/components/qa/post-body");
    const { AnswerCard } = await import("@/components/qa/answer-card");
    const { uploadImageOrigins } = await import("@/lib/uploads/origin");
    const author = await trustedMember(t.pool, "Mallory Probe");
    const user = await sessionUser(author.id);
    const q = await askQuestion(user, { title: "Is <b>this</b> safe to post?", bodyMd: HOSTILE });
    if (!q.ok) throw new Error(q.message);
    const a = await answerQuestion(await sessionUser((await trustedMember(t.pool, "Second Probe")).id), q.id, { bodyMd: HOSTILE });
    if (!a.ok) throw new Error(a.message);
    const { rows } = await t.pool.query("select body_md from questions where id = $1", [q.id]);
    expect(rows[0].body_md).toBe(HOSTILE);

    const question = (await getQuestionForViewer(null, q.id))!;
    const [answer] = await answersForViewer(null, question);
    const imageOrigins = uploadImageOrigins();
    expect(imageOrigins).toEqual(["http://127.0.0.1:4030"]);
    const html = renderToStaticMarkup(
      <>
        <PostBody bodyMd={question.bodyMd} photos={question.photos} imageOrigins={imageOrigins} label="the question" />
        <AnswerCard answer={answer!} viewerId={null} imageOrigins={imageOrigins} actions={{}} />
      </>,
    );
    // Raw HTML is shown as the text it is: never an element or an attribute.
    expect(html).not.toMatch(/<script/i);
    expect(tagsNamed(html, "script")).toEqual([]);
    expect(tags(html).flatMap((t) => Object.keys(t.attrs)).filter((a) => /^on/i.test(a))).toEqual([]);
    expect(html).toContain("&lt;script&gt;alert(&#x27;question&#x27;)&lt;/script&gt;");
    expect(html).not.toMatch(/javascript:/i);
    expect(tagsNamed(html, "a").filter((tag) => tag.attrs.href !== undefined)).toEqual([]);
    // The foreign image is refused; the one from the uploads host is kept, in both posts.
    expect(tagsNamed(html, "img").map((img) => img.attrs.src)).toEqual(["http://127.0.0.1:4030/f/bench.webp", "http://127.0.0.1:4030/f/bench.webp"]);
    expect(html).toContain("image not shown: foreign");
    expect(html.match(/Before the attack\./g)).toHaveLength(2);
    expect(html).toContain("<strong>bold</strong>");
  });
});
