import { afterEach, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { EngineeringInputError } from "@/lib/engineering";
import { handleJsonPost, jsonError, parseJsonBody } from "@/lib/http/json";
import { postJson } from "./request";

const schema = z.object({ volts: z.number().positive() });

afterEach(() => {
  vi.restoreAllMocks();
});

describe("lib/http/json", () => {
  it("jsonError answers { error, message, fieldErrors } with the status", async () => {
    const response = jsonError(409, "conflict", "Already taken.", { slug: ["In use."] });
    expect(response.status).toBe(409);
    expect(response.headers.get("content-type")).toMatch(/application\/json/);
    expect(await response.json()).toEqual({ error: "conflict", message: "Already taken.", fieldErrors: { slug: ["In use."] } });
  });

  it("parseJsonBody returns the parsed data or a ready 422", async () => {
    const ok = await parseJsonBody(postJson({ volts: 5 }), schema);
    expect(ok).toEqual({ ok: true, data: { volts: 5 } });
    const bad = await parseJsonBody(postJson({ volts: 0 }), schema);
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.response.status).toBe(422);
      expect((await bad.response.json()).fieldErrors.volts).toHaveLength(1);
    }
  });

  it("refuses an oversized body with 413", async () => {
    const bad = await parseJsonBody(postJson({ volts: 1, pad: "x".repeat(70_000) }), schema);
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.response.status).toBe(413);
  });

  it("turns an EngineeringInputError into a 422 on its field, with an optional prefix", async () => {
    const throwing = () => {
      throw new EngineeringInputError("mainsVrms", "State the mains voltage.");
    };
    const response = await handleJsonPost(postJson({ volts: 1 }), schema, throwing, { route: "t", fieldPrefix: "declaration." });
    expect(response.status).toBe(422);
    expect(await response.json()).toEqual({
      error: "invalid_input",
      message: "State the mains voltage.",
      fieldErrors: { "declaration.mainsVrms": ["State the mains voltage."] },
    });
  });

  it("logs anything else and answers a generic 500 that leaks nothing", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => {});
    const response = await handleJsonPost(postJson({ volts: 1 }), schema, () => {
      throw new Error("database password is hunter2");
    }, { route: "t" });
    expect(response.status).toBe(500);
    const body = await response.json();
    expect(body.error).toBe("internal_error");
    expect(JSON.stringify(body)).not.toContain("hunter2");
    expect(log).toHaveBeenCalledOnce();
  });
});
