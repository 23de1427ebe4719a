import { beforeEach, describe, expect, it, vi } from "vitest";

// The guard's inputs are the Auth.js session and the roles in the database; both are replaced here
// so the test exercises the guard's own decisions and responses.
const state = vi.hoisted(() => ({ session: null as null | { user: { id: string } }, roles: [] as string[] }));

vi.mock("@/lib/auth/config", () => ({ auth: async () => state.session }));
vi.mock("@/db/queries/users", () => ({
  getUserWithRoles: async (id: string) => ({ id, email: `${id}@larkspur.test`, name: null, roles: state.roles }),
}));

const { guardRoute, requireUser, AccessDeniedError } = await import("@/lib/auth/guard");

const handler = vi.fn(async (_req: Request, user: { id: string }) => Response.json({ hello: user.id }));
const route = guardRoute(["admin"], handler);
const call = () => route(new Request("http://localhost/api/admin/users"), { params: Promise.resolve({}) });

describe("guardRoute", () => {
  beforeEach(() => {
    state.session = null;
    state.roles = [];
    handler.mockClear();
  });

  it("answers 401 JSON to a visitor and never runs the handler", async () => {
    const res = await call();
    expect(res.status).toBe(401);
    expect(await res.json()).toMatchObject({ error: "not_signed_in" });
    expect(handler).not.toHaveBeenCalled();
  });

  it("answers 403 JSON to a signed-in person without the role", async () => {
    state.session = { user: { id: "noor" } };
    state.roles = ["member", "seller"];
    const res = await call();
    expect(res.status).toBe(403);
    expect(res.headers.get("content-type")).toContain("application/json");
    expect(await res.json()).toMatchObject({ error: "forbidden" });
    expect(handler).not.toHaveBeenCalled();
  });

  it("runs the handler with the user when the role is held", async () => {
    state.session = { user: { id: "oriel" } };
    state.roles = ["member", "admin"];
    const res = await call();
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ hello: "oriel" });
    expect(handler).toHaveBeenCalledOnce();
  });
});

describe("requireUser", () => {
  beforeEach(() => {
    state.session = null;
    state.roles = [];
  });

  it("throws a 401 AccessDeniedError for a visitor", async () => {
    await expect(requireUser()).rejects.toMatchObject({ status: 401 });
    await expect(requireUser()).rejects.toBeInstanceOf(AccessDeniedError);
  });

  it("throws 403 for the wrong role and returns the user for the right one", async () => {
    state.session = { user: { id: "sefa" } };
    state.roles = ["moderator"];
    await expect(requireUser(["seller"])).rejects.toMatchObject({ status: 403 });
    await expect(requireUser(["moderator"])).resolves.toMatchObject({ id: "sefa" });
  });
});
