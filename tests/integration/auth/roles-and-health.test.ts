import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import { seedDemo } from "@/db/seed";
import { freshDatabase } from "../../support/test-database";

let database: Awaited<ReturnType<typeof freshDatabase>>;
let pool: pg.Pool;

beforeAll(async () => {
  database = await freshDatabase("roles");
  await seedDemo(database.url);
  // The app's modules read the database address from the environment on first use.
  process.env.DATABASE_URL = database.url;
  pool = new pg.Pool({ connectionString: database.url });
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await pool.end();
  await database.drop();
});

describe("changeRole", () => {
  it("grants a role and writes one audit entry naming the actor", async () => {
    const { changeRole, getUserWithRoles } = await import("@/db/queries/users");
    expect(await changeRole({ actorId: "demo-admin", userId: "demo-builder", role: "seller", grant: true })).toEqual({ changed: true });
    expect((await getUserWithRoles("demo-builder"))?.roles).toContain("seller");
    // Granting again changes nothing and writes nothing.
    expect(await changeRole({ actorId: "demo-admin", userId: "demo-builder", role: "seller", grant: true })).toEqual({ changed: false });
    const { rows } = await pool.query("select actor_id, action, subject_id, details from audit_log where subject_id = 'demo-builder'");
    expect(rows).toEqual([{ actor_id: "demo-admin", action: "role.granted", subject_id: "demo-builder", details: { role: "seller" } }]);
  });

  it("revokes a role with its own audit entry", async () => {
    const { changeRole, getUserWithRoles } = await import("@/db/queries/users");
    expect(await changeRole({ actorId: "demo-admin", userId: "demo-builder", role: "seller", grant: false })).toEqual({ changed: true });
    expect((await getUserWithRoles("demo-builder"))?.roles).not.toContain("seller");
    const { rows } = await pool.query("select action from audit_log where subject_id = 'demo-builder' order by id");
    expect(rows.map((r) => r.action)).toEqual(["role.granted", "role.revoked"]);
  });

  it("refuses an unknown person and writes nothing", async () => {
    const { changeRole, NotFoundError } = await import("@/db/queries/users");
    await expect(changeRole({ actorId: "demo-admin", userId: "nobody", role: "seller", grant: true })).rejects.toBeInstanceOf(NotFoundError);
    const { rows } = await pool.query("select count(*)::int as n from audit_log where subject_id = 'nobody'");
    expect(rows[0].n).toBe(0);
  });

  it("listUsers returns each person once with all their roles", async () => {
    const { listUsers } = await import("@/db/queries/users");
    const all = await listUsers({});
    const adminRow = all.find((u) => u.id === "demo-admin");
    expect(adminRow?.roles.sort()).toEqual(["admin", "member"]);
    expect(new Set(all.map((u) => u.id)).size).toBe(all.length);
    expect((await listUsers({ search: "idunn" })).map((u) => u.id)).toEqual(["demo-seller-magnetics"]);
  });
});

describe("GET /api/health", () => {
  it("answers 200 with db up while PostgreSQL answers", async () => {
    const { GET } = await import("@/app/api/health/route");
    const res = await GET();
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ ok: true, db: "up" });
  });

  it("answers 503 with db down when PostgreSQL is unreachable, without hanging", async () => {
    const { closeDb } = await import("@/db/client");
    await closeDb();
    const { _resetEnvForTests } = await import("@/lib/env");
    process.env.DATABASE_URL = "postgres://fluxyard@127.0.0.1:1/nowhere";
    _resetEnvForTests();
    const { GET } = await import("@/app/api/health/route");
    const started = Date.now();
    const res = await GET();
    expect(res.status).toBe(503);
    expect(await res.json()).toEqual({ ok: false, db: "down" });
    expect(Date.now() - started).toBeLessThan(10_000);
    await closeDb();
    process.env.DATABASE_URL = database.url;
    _resetEnvForTests();
  });
});
