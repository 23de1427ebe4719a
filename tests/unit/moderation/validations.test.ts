import { describe, expect, it } from "vitest";
import { relativeTime } from "@/components/moderation/relative-time";
import { holdListingSchema, policyFormValues, publishPolicySchema, reasonsFromForm, sendBackListingSchema } from "@/lib/validations/moderation";

describe("sendBackListingSchema", () => {
  it("takes a reason per safety topic or under general", () => {
    const parsed = sendBackListingSchema.parse({
      reasons: [
        { topic: "stored-charge", text: "  State the wait in seconds.  " },
        { topic: "general", text: "The cover photo is blurred." },
      ],
    });
    expect(parsed.reasons).toEqual([
      { topic: "stored-charge", text: "State the wait in seconds." },
      { topic: "general", text: "The cover photo is blurred." },
    ]);
  });

  it("refuses no reasons, an unknown topic, an empty text and a topic given twice", () => {
    expect(sendBackListingSchema.safeParse({ reasons: [] }).success).toBe(false);
    expect(sendBackListingSchema.safeParse({ reasons: [{ topic: "photos", text: "Blurred." }] }).success).toBe(false);
    expect(sendBackListingSchema.safeParse({ reasons: [{ topic: "general", text: "  " }] }).success).toBe(false);
    const twice = sendBackListingSchema.safeParse({
      reasons: [
        { topic: "general", text: "One." },
        { topic: "general", text: "Two." },
      ],
    });
    expect(twice.success).toBe(false);
  });

  it("reads the form's rows in order, blank rows included so errors line up with them", () => {
    const form = new FormData();
    form.append("reasonTopic", "stored-charge");
    form.append("reasonText", "Give the wait.");
    form.append("reasonTopic", "");
    form.append("reasonText", "");
    expect(reasonsFromForm(form)).toEqual([
      { topic: "stored-charge", text: "Give the wait." },
      { topic: "", text: "" },
    ]);
  });
});

describe("holdListingSchema", () => {
  it("needs a reason the seller can read", () => {
    expect(holdListingSchema.safeParse({ reason: "" }).success).toBe(false);
    expect(holdListingSchema.parse({ reason: " Bleeder missing on the shipped board. " }).reason).toBe("Bleeder missing on the shipped board.");
  });
});

describe("publishPolicySchema", () => {
  const form = (fields: Record<string, string>) => {
    const data = new FormData();
    for (const [k, v] of Object.entries(fields)) data.append(k, v);
    return policyFormValues(data);
  };
  const base = {
    summary: "Notes must be at least 40 words from now on.",
    minWords: "40",
    safeVoltageV: "60",
    storedChargeThresholdMicroC: "45",
    waitMarginFactor: "1.5",
    graceDays: "14",
  };

  it("coerces the form's text into numbers; a blank per-topic field means no override", () => {
    const parsed = publishPolicySchema.parse(form({ ...base, "topicMinWords.stored-charge": "50", "topicMinWords.arc-hazards": "" }));
    // 60 V DC and 45 µC: the thresholds PRODUCT.md's policy section names.
    expect(parsed).toMatchObject({ minWords: 40, safeVoltageV: 60, storedChargeThresholdMicroC: 45, waitMarginFactor: 1.5, graceDays: 14 });
    expect(parsed.topicMinWords["stored-charge"]).toBe(50);
    expect(parsed.topicMinWords["arc-hazards"]).toBeUndefined();
  });

  it("refuses a wait margin under 1 (the wait could then be shorter than the discharge) and a grace of 0 days", () => {
    const result = publishPolicySchema.safeParse(form({ ...base, waitMarginFactor: "0.9", graceDays: "0", minWords: "2.5" }));
    expect(result.success).toBe(false);
    const paths = result.success ? [] : result.error.issues.map((i) => i.path.join("."));
    expect(paths.sort()).toEqual(["graceDays", "minWords", "waitMarginFactor"]);
  });
});

describe("relativeTime", () => {
  // English wording of Intl.RelativeTimeFormat with numeric: "auto" (ECMA-402, CLDR data).
  const now = Date.parse("2026-03-10T12:00:00Z");
  it("uses the largest whole unit", () => {
    expect(relativeTime("2026-03-10T09:00:00Z", now)).toBe("3 hours ago");
    expect(relativeTime("2026-03-10T11:59:30Z", now)).toBe("just now");
    expect(relativeTime("2026-03-09T12:00:00Z", now)).toBe("yesterday");
    expect(relativeTime("2026-03-24T12:00:00Z", now)).toBe("in 14 days");
    // A grace period published a minute ago: still 14 days, not 13.
    expect(relativeTime("2026-03-24T11:59:00Z", now)).toBe("in 14 days");
  });
});
