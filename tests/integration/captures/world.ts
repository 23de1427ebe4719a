// A database with the demo accounts and a small file server standing in for the upload store:
// capture files are registered here and their uploads rows point at it, so measuring reads the
// original back over HTTP as it does from the real store. A test-only trigger records every
// progress value a capture passes through.
import { randomUUID } from "node:crypto";
import { createServer, type Server } from "node:http";
import type { Socket } from "node:net";
import pg from "pg";
import { seedDemo } from "@/db/seed";
import type { SessionUser } from "@/lib/auth/access";
import { freshDatabase } from "../../support/test-database";

export const DEMO_KIT_ID = "0b7d1c3e-5a21-4c6e-9f10-000000000001";
export const BUILDER: SessionUser = { id: "demo-builder", email: "noor.builds@larkspur.test", name: "Noor", roles: ["member"] };
export const REVIEWER: SessionUser = { id: "demo-reviewer", email: "tamsin.reviews@larkspur.test", name: "Tamsin", roles: ["member", "reviewer"] };
export const MODERATOR: SessionUser = { id: "demo-moderator", email: "sefa.moderator@larkspur.test", name: null, roles: ["member", "moderator"] };
export const STRANGER: SessionUser = { id: "demo-seller-kits", email: "bram.kits@larkspur.test", name: null, roles: ["member", "seller"] };
/** Another member, to play a second reviewer of the same log. */
export const OTHER_REVIEWER: SessionUser = { id: "demo-seller-magnetics", email: "idunn.winds@larkspur.test", name: null, roles: ["member", "seller"] };

export type World = {
  pool: pg.Pool;
  storeUrl: string;
  /** hold back a file's answer until `release` is called, to watch a capture wait */
  hold(key: string): { release(): void };
  close(): Promise<void>;
};

const files = new Map<string, Buffer>();
const held = new Map<string, Promise<void>>();

export async function startWorld(label: string): Promise<World> {
  const database = await freshDatabase(label);
  await seedDemo(database.url);
  process.env.DATABASE_URL = database.url;
  const sockets = new Set<Socket>();
  const server: Server = createServer(async (req, res) => {
    const key = decodeURIComponent((req.url ?? "").replace(/^\/f\//, ""));
    await held.get(key);
    const bytes = files.get(key);
    if (!bytes) return void res.writeHead(404).end();
    res.writeHead(200, { "content-type": "text/csv", "content-length": String(bytes.length) }).end(bytes);
  });
  server.on("connection", (s) => {
    sockets.add(s);
    s.on("close", () => sockets.delete(s));
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const address = server.address();
  const storeUrl = `http://127.0.0.1:${typeof address === "object" && address ? address.port : 0}`;
  const pool = new pg.Pool({ connectionString: database.url, max: 4 });
  await pool.query(`
    create table test_capture_progress (capture_id uuid, state text, progress int, at timestamptz default clock_timestamp());
    create function test_log_capture_progress() returns trigger language plpgsql as $$
      begin insert into test_capture_progress (capture_id, state, progress) values (new.id, new.state, new.progress); return new; end $$;
    create trigger test_capture_progress after update on captures for each row execute function test_log_capture_progress();`);
  return {
    pool,
    storeUrl,
    hold: (key) => {
      let release = () => {};
      held.set(key, new Promise<void>((resolve) => (release = resolve)));
      return { release: () => (held.delete(key), release()) };
    },
    close: async () => {
      const { closeDb } = await import("@/db/client");
      await closeDb();
      await pool.end();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        for (const s of sockets) s.destroy();
      });
      await database.drop();
    },
  };
}

/** A capture file the builder uploaded: in the store and in `uploads`, as the capture route leaves it. */
export async function uploadCapture(world: World, ownerId: string, text: string | Buffer, name = "capture.csv"): Promise<string> {
  const key = `test-${randomUUID()}`;
  const bytes = typeof text === "string" ? Buffer.from(text, "utf8") : text;
  files.set(key, bytes);
  await world.pool.query(
    "insert into uploads (key, owner_id, purpose, original_name, content_type, bytes, url) values ($1, $2, 'capture', $3, 'text/csv', $4, $5)",
    [key, ownerId, name, bytes.length, `${world.storeUrl}/f/${key}`],
  );
  return key;
}

/** A log from the demo welder kit with one reading at each named checkpoint, as the builder typed it. */
export async function logWithReadings(
  ownerId: string,
  readings: { checkpoint: string; value: number; unit: string }[],
  visibility: "private" | "public" = "private",
): Promise<{ logId: string; readingIds: Record<string, string> }> {
  const bench = await import("@/db/queries/bench");
  const actor = { id: ownerId, roles: ["member" as const] };
  const { id: logId } = await bench.createLog(ownerId, { kitListingId: DEMO_KIT_ID, title: "" });
  const checkpoints = await bench.logCheckpointsOf(logId);
  const readingIds: Record<string, string> = {};
  for (const r of readings) {
    const checkpoint = checkpoints.find((c) => c.name === r.checkpoint);
    if (!checkpoint) throw new Error(`no checkpoint ${r.checkpoint}`);
    const recorded = await bench.recordReading(actor, logId, { checkpointId: checkpoint.id, value: r.value, unit: r.unit, instrument: "Bench scope", note: "", photos: [] });
    readingIds[r.checkpoint] = recorded.id;
  }
  if (visibility === "public") await bench.setVisibility(actor, logId, "public");
  return { logId, readingIds };
}

/** A review session on the log in the given state, as booking and accepting leave it. */
export async function reviewSession(world: World, logId: string, reviewerId: string, state: string): Promise<string> {
  const { rows } = await world.pool.query(
    `insert into review_sessions (log_id, builder_id, reviewer_id, stages, state, price_minor, currency, fee_bps, fee_minor, reviewer_share_minor, respond_by, accepted_at)
     select $1, owner_id, $2, '["control-supply"]', $3, 4500, 'EUR', 1000, 450, 4050, now() + interval '2 days', now() from bring_up_logs where id = $1 returning id`,
    [logId, reviewerId, state],
  );
  return rows[0].id as string;
}

export async function progressSeen(world: World, captureId: string): Promise<{ state: string; progress: number }[]> {
  const { rows } = await world.pool.query("select state, progress from test_capture_progress where capture_id = $1 order by at", [captureId]);
  return rows;
}
