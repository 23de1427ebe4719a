// Field errors from a Zod error: one entry per issue under its dotted path, in a plain object that a
// server action can hand to a client component, and that a field named like an Object.prototype
// member cannot pollute.
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { addFieldError, fieldErrorsFromZod } from "@/lib/http/field-errors";

describe("lib/http/field-errors", () => {
  it("groups messages by dotted path, '' for the body as a whole", () => {
    const schema = z.object({ declaration: z.object({ mainsVrms: z.number().max(250, { error: "Too high." }) }), name: z.string() });
    const result = schema.safeParse({ declaration: { mainsVrms: 400 }, name: 3 });
    expect(result.success).toBe(false);
    const errors = fieldErrorsFromZod(result.error!);
    expect(errors["declaration.mainsVrms"]).toEqual(["Too high."]);
    expect(errors.name).toHaveLength(1);
    expect(fieldErrorsFromZod(z.object({}).safeParse(3).error!)[""]).toHaveLength(1);
  });

  it("returns a plain object, which React can pass from a server action to the client", () => {
    const errors = fieldErrorsFromZod(z.object({ a: z.string() }).safeParse({}).error!);
    expect(Object.getPrototypeOf(errors)).toBe(Object.prototype);
    expect(JSON.parse(JSON.stringify(errors))).toEqual(errors);
  });

  it("keeps fields named after Object.prototype members as own entries", () => {
    const schema = z.object({ constructor: z.string(), toString: z.string() });
    const errors = fieldErrorsFromZod(schema.safeParse(Object.create(null)).error!);
    expect(Object.keys(errors).sort()).toEqual(["constructor", "toString"]);
    expect(Array.isArray(errors.constructor)).toBe(true);
    expect(({} as Record<string, unknown>).constructor).toBe(Object);
    const out: Record<string, string[]> = {};
    addFieldError(out, "__proto__", "x");
    expect(Object.hasOwn(out, "__proto__")).toBe(true);
    expect(Object.getPrototypeOf(out)).toBe(Object.prototype);
    expect(({} as Record<string, unknown>).x).toBeUndefined();
  });

  it("reports an unknown key on that key, with the caller's wording", () => {
    const schema = z.object({ from: z.string() }).strict();
    const error = schema.safeParse({ from: "0", zoom: "2", pan: "1" }).error!;
    expect(fieldErrorsFromZod(error, (issue) => (issue.code === "unrecognized_keys" ? "Unknown." : issue.message))).toEqual({ zoom: ["Unknown."], pan: ["Unknown."] });
  });
});
