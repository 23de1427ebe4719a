import { describe, expect, it } from "vitest";
import { decideAccess, effectiveRoles, hasRole, type SessionUser } from "@/lib/auth/access";

const person = (roles: SessionUser["roles"]): SessionUser => ({ id: "u1", email: "a@b.test", name: null, roles });

describe("decideAccess", () => {
  it("refuses a visitor with 401", () => {
    expect(decideAccess(null)).toMatchObject({ ok: false, status: 401 });
    expect(decideAccess(null, ["admin"])).toMatchObject({ ok: false, status: 401 });
  });

  it("lets any signed-in person through when no role is asked for", () => {
    expect(decideAccess(person([]))).toMatchObject({ ok: true });
  });

  it("treats every signed-in person as a member", () => {
    expect(decideAccess(person([]), ["member"])).toMatchObject({ ok: true });
  });

  it("refuses the wrong role with 403 and names the role needed", () => {
    const decision = decideAccess(person(["member", "seller"]), ["admin"]);
    expect(decision).toMatchObject({ ok: false, status: 403 });
    if (!decision.ok) expect(decision.reason).toContain("admin");
  });

  it("accepts any one of several roles", () => {
    expect(decideAccess(person(["moderator"]), ["admin", "moderator"])).toMatchObject({ ok: true });
    expect(decideAccess(person(["reviewer"]), ["admin", "moderator"])).toMatchObject({ ok: false, status: 403 });
  });

  it("an admin can do what a moderator can, but not the reverse", () => {
    expect(hasRole(person(["admin"]), "moderator")).toBe(true);
    expect(hasRole(person(["moderator"]), "admin")).toBe(false);
  });

  it("seller and reviewer are not implied by staff roles", () => {
    expect(effectiveRoles(["admin"]).has("seller")).toBe(false);
    expect(effectiveRoles(["admin"]).has("reviewer")).toBe(false);
  });
});
