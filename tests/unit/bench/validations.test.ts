import { describe, expect, it } from "vitest";
import { builderCheckpointSchema, createLogSchema, parseReadingNumber, readingSchema } from "@/lib/validations/bench";

const checkpointId = "3f2a7c1e-5b6d-4e8f-9a0b-1c2d3e4f5a6b";

describe("parseReadingNumber", () => {
  it("reads what a meter shows, with spaces as thousands separators (ISO 80000-1 groups digits with spaces)", () => {
    expect(parseReadingNumber("41 000")).toBe(41_000);
    expect(parseReadingNumber("0.29")).toBe(0.29);
    expect(parseReadingNumber("-15.2")).toBe(-15.2);
    expect(parseReadingNumber("4.7e-6")).toBe(4.7e-6);
    expect(parseReadingNumber(".5")).toBe(0.5);
  });

  it("refuses a decimal comma, text and empty input rather than guessing", () => {
    for (const text of ["0,29", "1,500", "", "twelve", "12 V", "1e", "--3"]) expect(parseReadingNumber(text)).toBeNull();
  });
});

describe("readingSchema", () => {
  it("turns the typed text into a number and defaults the optional fields", () => {
    expect(readingSchema.parse({ checkpointId, value: "41 000", unit: "Hz" })).toEqual({ checkpointId, value: 41_000, unit: "Hz", instrument: "", note: "", photos: [] });
  });

  it("says what is missing instead of reading an empty value as 0", () => {
    const result = readingSchema.safeParse({ checkpointId, value: " ", unit: "V" });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]).toMatchObject({ path: ["value"], message: "Enter the reading." });
  });

  it("allows at most six photos, the reading-photo route's limit", () => {
    const photos = Array.from({ length: 7 }, (_, i) => ({ key: `k${i}`, alt: "" }));
    expect(readingSchema.safeParse({ checkpointId, value: "1", unit: "V", photos }).success).toBe(false);
  });
});

describe("createLogSchema", () => {
  it("a kit needs no title; a build of one's own does", () => {
    expect(createLogSchema.safeParse({ kitListingId: checkpointId, title: "" }).success).toBe(true);
    const own = createLogSchema.safeParse({ kitListingId: "", title: "" });
    expect(own.error?.issues[0]).toMatchObject({ path: ["title"] });
  });
});

describe("builderCheckpointSchema", () => {
  it("refuses a range whose highest value is below its lowest", () => {
    const result = builderCheckpointSchema.safeParse({ stage: "low-current", name: "Fan rail", measure: "12 V rail at the fan header", unit: "V", expectedMin: "13", expectedMax: "11" });
    expect(result.error?.issues[0]).toMatchObject({ path: ["expectedMax"] });
  });
});
