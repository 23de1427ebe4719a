import { describe, expect, it } from "vitest";
import { decideLogAccess, type LogAccessFacts } from "@/lib/bench/log-access";

// The access rule of issue 6: owner always; anyone when public; a reviewer whose session is
// accepted, delivered, closed or disputed; moderators (admins hold every moderator right, PRODUCT.md).
const facts = (over: Partial<LogAccessFacts>): LogAccessFacts => ({ viewer: null, ownerId: "noor", visibility: "private", reviewerSessionStates: [], ...over });
const member = { id: "someone", roles: ["member"] as const };

describe("decideLogAccess", () => {
  it("the owner always, private or public", () => {
    expect(decideLogAccess(facts({ viewer: { id: "noor", roles: [] } }))).toBe("owner");
    expect(decideLogAccess(facts({ viewer: { id: "noor", roles: [] }, visibility: "public" }))).toBe("owner");
  });

  it("a private log is hidden from visitors and other members", () => {
    expect(decideLogAccess(facts({}))).toBeNull();
    expect(decideLogAccess(facts({ viewer: member }))).toBeNull();
  });

  it("a public log is readable by anyone, visitors included", () => {
    expect(decideLogAccess(facts({ visibility: "public" }))).toBe("public");
    expect(decideLogAccess(facts({ viewer: member, visibility: "public" }))).toBe("public");
  });

  it("a reviewer reads it once a session is accepted, and keeps reading it after delivery, closing or a dispute", () => {
    for (const state of ["accepted", "delivered", "closed", "disputed"] as const) {
      expect(decideLogAccess(facts({ viewer: member, reviewerSessionStates: [state] }))).toBe("reviewer");
    }
  });

  it("a request not accepted, declined or expired shares nothing", () => {
    expect(decideLogAccess(facts({ viewer: member, reviewerSessionStates: ["requested", "declined", "expired"] }))).toBeNull();
  });

  it("moderators and admins read any log", () => {
    expect(decideLogAccess(facts({ viewer: { id: "sefa", roles: ["moderator"] } }))).toBe("moderator");
    expect(decideLogAccess(facts({ viewer: { id: "oriel", roles: ["admin"] } }))).toBe("moderator");
    expect(decideLogAccess(facts({ viewer: { id: "bram", roles: ["seller", "reviewer"] } }))).toBeNull();
  });
});
