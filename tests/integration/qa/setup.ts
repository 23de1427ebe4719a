// One database per test file, seeded with the demo accounts; the app's modules are imported only
// after DATABASE_URL points at it. Members and trusted members are made here with plain SQL.
import { randomBytes } from "node:crypto";
import pg from "pg";
import { seedDemo } from "../../../db/seed";
import { freshDatabase } from "../../support/test-database";

export type QaTestDb = { url: string; pool: pg.Pool; teardown(): Promise<void> };

export async function setupQaDb(label: string): Promise<QaTestDb> {
  const database = await freshDatabase(label);
  await seedDemo(database.url);
  process.env.DATABASE_URL = database.url;
  const pool = new pg.Pool({ connectionString: database.url, max: 4 });
  // pool.end() resolves before its sockets have closed; the forced drop that follows may cut one
  // that is still closing, which is expected here and must not surface as an uncaught error.
  pool.on("error", () => {});
  return {
    url: database.url,
    pool,
    teardown: async () => {
      // Posts queue their e-mails through pg-boss; stop its sender so the run can end.
      const cache = (globalThis as { __fluxyardBoss?: { boss?: Promise<{ stop(o: object): Promise<void> }> } }).__fluxyardBoss;
      const boss = await cache?.boss?.catch(() => undefined);
      if (cache) cache.boss = undefined;
      await boss?.stop({ graceful: false, close: true }).catch(() => {});
      const { closeDb } = await import("@/db/client");
      await closeDb();
      await pool.end();
      await database.drop();
    },
  };
}

/** A member who has just signed up: no posts, no roles beyond member. */
export async function newMember(pool: pg.Pool, name: string): Promise<{ id: string; email: string; name: string; roles: ["member"] }> {
  const id = `qa-${name.toLowerCase().replace(/[^a-z]+/g, "-")}-${randomBytes(3).toString("hex")}`;
  const email = `${id}@larkspur.test`;
  await pool.query("insert into users (id, name, email) values ($1, $2, $3)", [id, name, email]);
  await pool.query("insert into user_roles (user_id, role) values ($1, 'member')", [id]);
  return { id, email, name, roles: ["member"] };
}

/** A member with two approved questions already, so their posts skip pre-moderation. */
export async function trustedMember(pool: pg.Pool, name: string) {
  const member = await newMember(pool, name);
  for (const n of [1, 2]) {
    await pool.query("insert into questions (author_id, title, body_md, state) values ($1, $2, $3, 'visible')", [
      member.id,
      `Earlier question ${n} from ${name}`,
      "An earlier question that a moderator approved.",
    ]);
  }
  return member;
}

export async function sessionUser(id: string) {
  const { getUserWithRoles } = await import("@/db/queries/users");
  const user = await getUserWithRoles(id);
  if (!user) throw new Error(`no user ${id}`);
  return user;
}

export const QUESTION = {
  title: "Bus reads 20 V low through the series lamp",
  bodyMd: "With a 100 W lamp in series the bus settles at 305 V DC instead of about 325 V. The lamp glows dimly. Is that expected?",
};

export const ANSWER = { bodyMd: "Yes: the lamp drops some voltage while the bus capacitors draw current. Check the idle input current next." };

export async function auditFor(pool: pg.Pool, subjectId: string) {
  const { rows } = await pool.query<{ actor_id: string | null; action: string; subject_type: string; reason: string | null; details: Record<string, unknown> }>(
    "select actor_id, action, subject_type, reason, details from audit_log where subject_id = $1 order by id",
    [subjectId],
  );
  return rows;
}

export async function outboxTo(pool: pg.Pool, to: string) {
  const { rows } = await pool.query<{ template: string; props: Record<string, unknown> }>('select template, props from mail_outbox where "to" = $1 order by created_at', [to]);
  return rows;
}

export async function postState(pool: pg.Pool, kind: "question" | "answer", id: string): Promise<string> {
  const { rows } = await pool.query(`select state from ${kind === "question" ? "questions" : "answers"} where id = $1`, [id]);
  return rows[0]?.state;
}
