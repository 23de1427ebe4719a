// One database per test file with the demo accounts; app modules are imported after DATABASE_URL
// points at it. Rows a seller would have made through other screens (uploads, a shop) are written
// straight in.
import pg from "pg";
import { seedDemo } from "../../../db/seed";
import { freshDatabase } from "../../support/test-database";
import type { SafetyDeclaration, SafetyNote } from "../../../lib/policy";

export type SellingDb = { url: string; pool: pg.Pool; teardown(): Promise<void> };

export async function setupSellingDb(label: string): Promise<SellingDb> {
  const database = await freshDatabase(label);
  await seedDemo(database.url);
  process.env.DATABASE_URL = database.url;
  const pool = new pg.Pool({ connectionString: database.url, max: 2 });
  // Dropping the database at the end cuts connections that are still closing; that is expected.
  pool.on("error", () => {});
  return {
    url: database.url,
    pool,
    teardown: async () => {
      // A transition that mails queues through pg-boss; stop its sender so the run can end.
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

export async function addUpload(pool: pg.Pool, ownerId: string, key: string, purpose: "listing-photo" | "listing-document"): Promise<void> {
  const type = purpose === "listing-photo" ? "image/webp" : "application/pdf";
  await pool.query(
    "insert into uploads (key, owner_id, purpose, original_name, content_type, bytes, url) values ($1, $2, $3, $4, $5, 1000, $6)",
    [key, ownerId, purpose, `${key}.bin`, type, `http://127.0.0.1:4030/f/${key}`],
  );
}

/** The seller's shop with payouts on or off (the seed may already have opened one; it is then reset). */
export async function addShop(pool: pg.Pool, userId: string, shopName: string, enabled: boolean): Promise<void> {
  await pool.query(
    `insert into seller_profiles (user_id, shop_name, slug, profile_md, country, returns_policy_md, payout_account_id, charges_enabled, payouts_enabled)
     values ($1, $2, $3, 'Invented demo shop.', 'NL', 'Returns within 30 days.', $4, $5, $5)
     on conflict (user_id) do update set country = 'NL', payout_account_id = excluded.payout_account_id, charges_enabled = $5, payouts_enabled = $5`,
    [userId, shopName, shopName.toLowerCase().replace(/[^a-z0-9]+/g, "-"), enabled ? `acct_test_${userId}` : null, enabled],
  );
}

/** 230 V +10 % (IEC 60038), 680 µF, 100 kΩ bleeder, live heatsinks: ≈358 V peak, 43.6 J, ≈123 s to 60 V. */
export const KIT_DECLARATION: SafetyDeclaration = {
  mainsConnected: true,
  mainsVrms: 230,
  mainsTolerance: 0.1,
  busCapacitanceF: 680e-6,
  bleederOhm: 100e3,
  liveHeatsinks: true,
  weldingSource: false,
};

const filler = "Work only on the unplugged board, keep one hand away from the bench, and use probes rated for the bus.";

/** A note for each topic KIT_DECLARATION requires, long enough for revision 1, with a 300 s wait. */
export function kitNotes(): SafetyNote[] {
  return [
    { topic: "mains-isolation", text: `Pull the plug at the wall before opening the case; the bridge and bus stay live while plugged in. ${filler}` },
    { topic: "stored-charge", text: `The 680 µF bus holds about 44 J. Wait five minutes after unplugging, then check with a meter that it reads below 60 V. ${filler}`, waitSeconds: 300 },
    { topic: "first-power-up", text: `Power the control supply alone first, then bring mains up through a 100 W series lamp and check the bus. ${filler}` },
    { topic: "protective-earth", text: `The case and heatsink frame are bonded to the earth stud; check continuity below 0.1 Ω with a meter. ${filler}` },
    { topic: "live-heatsinks", text: `Both heatsinks sit at bus potential; they are insulated from the case with pads and carry a warning label. ${filler}` },
    { topic: "codes-and-competence", text: `Local electrical codes and licensed practice take precedence over this sheet; build it only with mains experience. ${filler}` },
  ];
}
