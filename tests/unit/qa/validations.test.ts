import { describe, expect, it } from "vitest";
import { acceptAnswerSchema, askQuestionSchema, flagPostSchema, photosFromForm, questionFiltersSchema, voteSchema } from "@/lib/validations/qa";

// The Q&A's inputs as issue 6 describes them: a question with a title and Markdown text, about a
// listing or the general bench, optionally linking a log, with photos; a flag with a reason; a vote
// of ±1 (0 takes it back).

const question = { title: "Bus reads 20 V low on the lamp", bodyMd: "With the 100 W lamp in series the bus reads 305 V instead of 325 V." };

describe("askQuestionSchema", () => {
  it("takes a general question with no listing, log or photos, trimming the text", () => {
    const parsed = askQuestionSchema.parse({ ...question, title: `  ${question.title}  `, listingId: "", logId: "" });
    expect(parsed).toEqual({ title: question.title, bodyMd: question.bodyMd, listingId: undefined, logId: undefined, photos: [] });
  });

  it("takes a listing and a log by id, and photos by upload key", () => {
    const parsed = askQuestionSchema.parse({
      ...question,
      listingId: "0b7d1c3e-5a21-4c6e-9f10-000000000001",
      photos: [{ key: "abc", alt: "The bus capacitors" }],
    });
    expect(parsed.listingId).toBe("0b7d1c3e-5a21-4c6e-9f10-000000000001");
    expect(parsed.photos).toEqual([{ key: "abc", alt: "The bus capacitors" }]);
  });

  it("refuses a short title or text, a malformed id, seven photos and a photo listed twice", () => {
    expect(askQuestionSchema.safeParse({ ...question, title: "Help" }).success).toBe(false);
    expect(askQuestionSchema.safeParse({ ...question, bodyMd: "It broke." }).success).toBe(false);
    expect(askQuestionSchema.safeParse({ ...question, listingId: "welder" }).success).toBe(false);
    expect(askQuestionSchema.safeParse({ ...question, photos: Array.from({ length: 7 }, (_, i) => ({ key: `k${i}` })) }).success).toBe(false);
    expect(askQuestionSchema.safeParse({ ...question, photos: [{ key: "k" }, { key: "k" }] }).success).toBe(false);
  });
});

describe("votes, flags, acceptance and filters", () => {
  it("reads a vote from a form's string and refuses anything but 1, -1 and 0", () => {
    expect(voteSchema.parse({ value: "1" }).value).toBe(1);
    expect(voteSchema.parse({ value: "-1" }).value).toBe(-1);
    expect(voteSchema.parse({ value: 0 }).value).toBe(0);
    for (const value of ["2", "-5", "up", ""]) expect(voteSchema.safeParse({ value }).success, value).toBe(false);
  });

  it("needs a flag reason of a few characters", () => {
    expect(flagPostSchema.safeParse({ reason: "  " }).success).toBe(false);
    expect(flagPostSchema.parse({ reason: " Says to bridge the fuse. " }).reason).toBe("Says to bridge the fuse.");
  });

  it("accepts an answer by id, or none", () => {
    expect(acceptAnswerSchema.parse({}).answerId).toBeNull();
    expect(acceptAnswerSchema.parse({ answerId: null }).answerId).toBeNull();
    expect(acceptAnswerSchema.safeParse({ answerId: "nope" }).success).toBe(false);
  });

  it("falls back to the defaults for filters it cannot read", () => {
    expect(questionFiltersSchema.parse({})).toEqual({ listing: undefined, show: "newest", page: 1 });
    expect(questionFiltersSchema.parse({ listing: "x", show: "oldest", page: "-3" })).toEqual({ listing: undefined, show: "newest", page: 1 });
    expect(questionFiltersSchema.parse({ show: "unanswered", page: "3" })).toMatchObject({ show: "unanswered", page: 3 });
  });

  it("reads the photo uploader's hidden JSON input, treating a broken value as no photos", () => {
    const form = new FormData();
    form.set("photos", JSON.stringify([{ key: "k", url: "u", thumbUrl: "t", alt: "a" }]));
    expect(photosFromForm(form)).toEqual([{ key: "k", url: "u", thumbUrl: "t", alt: "a" }]);
    form.set("photos", "{not json");
    expect(photosFromForm(form)).toEqual([]);
  });
});
