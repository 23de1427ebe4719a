import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import { drizzle } from "drizzle-orm/node-postgres";
import { DrizzleAdapter } from "@auth/drizzle-adapter";
import { applyMigrations } from "@/db/migrate";
import * as schema from "@/db/schema";
import { seedDemo } from "@/db/seed";
import { DEMO_ACCOUNTS } from "@/db/seed-data";
import { createDatabaseIfMissing, dropDatabase, withDatabase } from "@/db/server";
import { freshDatabase, testServerUrl } from "../../support/test-database";

describe("migrations", () => {
  const name = `t_empty_${process.pid}`;
  const admin = () => testServerUrl("postgres");

  afterAll(async () => dropDatabase(admin(), name));

  it("apply to an empty database and create every table", async () => {
    await dropDatabase(admin(), name);
    await createDatabaseIfMissing(admin(), name);
    const url = withDatabase(admin(), name);
    await applyMigrations(url);
    await applyMigrations(url); // a second run is a no-op
    const client = new pg.Client({ connectionString: url });
    await client.connect();
    const { rows } = await client.query<{ table_name: string }>(
      "select table_name from information_schema.tables where table_schema = 'public' order by 1",
    );
    await client.end();
    expect(rows.map((r) => r.table_name)).toEqual(
      expect.arrayContaining(["accounts", "audit_log", "sessions", "user_roles", "users", "verification_tokens"]),
    );
  });
});

describe("database", () => {
  let database: Awaited<ReturnType<typeof freshDatabase>>;
  let pool: pg.Pool;
  let db: ReturnType<typeof drizzle<typeof schema>>;

  beforeAll(async () => {
    database = await freshDatabase("adapter");
    pool = new pg.Pool({ connectionString: database.url });
    db = drizzle(pool, { schema });
  });
  afterAll(async () => {
    await pool.end();
    await database.drop();
  });

  it("the Auth.js adapter creates a user, a session and a one-time verification token", async () => {
    const adapter = DrizzleAdapter(db, {
      usersTable: schema.users,
      accountsTable: schema.accounts,
      sessionsTable: schema.sessions,
      verificationTokensTable: schema.verificationTokens,
    });
    const user = await adapter.createUser!({ id: "ignored", email: "new.builder@larkspur.test", emailVerified: null });
    expect(user.id).toBeTruthy();
    expect(await adapter.getUserByEmail!("new.builder@larkspur.test")).toMatchObject({ id: user.id });

    const expires = new Date(Date.now() + 3_600_000);
    await adapter.createSession!({ sessionToken: "tok-1", userId: user.id, expires });
    const found = await adapter.getSessionAndUser!("tok-1");
    expect(found?.user.email).toBe("new.builder@larkspur.test");
    expect(found?.session.expires.getTime()).toBe(expires.getTime());

    await adapter.createVerificationToken!({ identifier: "new.builder@larkspur.test", token: "hashed", expires });
    expect(await adapter.useVerificationToken!({ identifier: "new.builder@larkspur.test", token: "hashed" })).toMatchObject({ token: "hashed" });
    // used once: a second use finds nothing
    expect(await adapter.useVerificationToken!({ identifier: "new.builder@larkspur.test", token: "hashed" })).toBeNull();

    await adapter.deleteSession!("tok-1");
    expect(await adapter.getSessionAndUser!("tok-1")).toBeNull();
  });

  it("the audit log refuses updates and deletes", async () => {
    await db.insert(schema.auditLog).values({ action: "test.entry", subjectType: "test", subjectId: "1" });
    await expect(pool.query("update audit_log set reason = 'changed'")).rejects.toThrow(/append-only/);
    await expect(pool.query("delete from audit_log")).rejects.toThrow(/append-only/);
    await expect(pool.query("truncate audit_log")).rejects.toThrow(/append-only/);
    const { rows } = await pool.query("select count(*)::int as n from audit_log");
    expect(rows[0].n).toBe(1);
  });

  it("the demo seed is idempotent and gives every role an account", async () => {
    expect(await seedDemo(database.url)).toEqual({ created: true });
    const count = async () => (await pool.query("select (select count(*) from users)::int as u, (select count(*) from user_roles)::int as r")).rows[0];
    const first = await count();
    expect(await seedDemo(database.url)).toEqual({ created: false });
    expect(await count()).toEqual(first);
    const { rows } = await pool.query<{ role: string }>("select distinct role::text from user_roles order by 1");
    expect(rows.map((r) => r.role)).toEqual(["admin", "member", "moderator", "reviewer", "seller"]);
    const states = await pool.query<{ state: string }>("select distinct state::text from listings order by 1");
    expect(states.rows.map((r) => r.state)).toEqual(["draft", "held", "in_review", "live", "sent_back"]);
    // Magnetics carry their derived inductance for matching kits' requirements.
    const choke = await pool.query("select inductance_h from listings where slug = 'output-choke-20uh-110a'");
    // μ0·N²·Ae/(lg + le/μr) with N = 7, Ae = 10.7 cm², lg = 3.3 mm: about 19.5 µH (Erickson & Maksimović, ch. 13)
    expect(choke.rows[0].inductance_h).toBeGreaterThan(18e-6);
    expect(choke.rows[0].inductance_h).toBeLessThan(21e-6);
    const ids = await pool.query("select id from users where id = any($1)", [DEMO_ACCOUNTS.map((a) => a.id)]);
    expect(ids.rowCount).toBe(DEMO_ACCOUNTS.length);
  });
});
