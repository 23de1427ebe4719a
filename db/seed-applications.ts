// Applications to sell and to review in each state a moderator meets: waiting, approved, declined.
// (The two demo shops were approved when the base demo was set up; see seed.ts.)
import * as schema from "./schema";
import { DEMO_REVIEWER } from "./seed-data";
import { demoUuid, SEEDED_AT, seedAudit, type DemoClock, type SeedAudit, type SeedTx } from "./seed-support";

const MODERATOR = "demo-moderator";

type Decision = { status: "pending" } | { status: "approved"; at: Date } | { status: "declined"; at: Date; reason: string };

export function demoSellerApplications({ ago }: DemoClock) {
  return [
    {
      n: 1,
      userId: "demo-applicant",
      at: ago(0, 20),
      shopName: "Adeyemi-Roos Cores",
      country: "NL",
      profileMd: "Ferrite E and ETD cores, gapped to order on a diamond lap and measured for AL before they ship.",
      returnsPolicyMd: "Ungapped cores within **30 days**, in their packing. Cores gapped to order cannot be returned.",
      returnsWindowDays: 30,
      decision: { status: "pending" } as Decision,
    },
    {
      n: 2,
      userId: "demo-member-declined",
      at: ago(15),
      shopName: "Holmqvist Surplus",
      country: "SE",
      profileMd: "Power semiconductors and capacitors from scrapped industrial drives, sold as found.",
      returnsPolicyMd: "No returns.",
      returnsWindowDays: 0,
      decision: {
        status: "declined",
        at: ago(14),
        reason: "Fluxyard lists parts that their seller made or tested. Parts of unknown history from scrapped drives cannot be sold here; you are welcome to apply again with parts you test.",
      } as Decision,
    },
  ];
}

export function demoReviewerApplications({ ago }: DemoClock) {
  return [
    {
      n: 1,
      userId: DEMO_REVIEWER.userId,
      at: new Date(SEEDED_AT.getTime() - 3 * 24 * 3_600_000),
      expertise: DEMO_REVIEWER.expertise,
      profileMd: DEMO_REVIEWER.profileMd,
      trackRecordMd: "Twenty-three welding inverters brought up at the Larkspur Yard bench since the cooperative opened, each with a written log; two of them are on the loan shelf.",
      priceMinor: DEMO_REVIEWER.priceMinor,
      decision: { status: "approved", at: new Date(SEEDED_AT.getTime() - 2 * 24 * 3_600_000) } as Decision,
    },
    {
      n: 2,
      userId: "demo-builder-2",
      at: ago(3),
      expertise: ["induction-heaters", "gate-drive"],
      profileMd: "I design and build induction heaters, from 500 W to 3 kW, and I read **gate-drive captures** closely.",
      trackRecordMd: "Four induction heaters of my own design brought up through a series lamp, all logged on Fluxyard, and a stick welder from the yard kit.",
      priceMinor: 3500,
      decision: { status: "pending" } as Decision,
    },
    {
      n: 3,
      userId: "demo-member-declined",
      at: ago(12),
      expertise: ["welding-inverters", "mains-input"],
      profileMd: "Years of repairing drives.",
      trackRecordMd: "Many repairs.",
      priceMinor: 2000,
      decision: {
        status: "declined",
        at: ago(11),
        reason: "A reviewer's track record needs bring-ups we can follow: logs, captures or builds others can vouch for. Apply again once you have some on Fluxyard.",
      } as Decision,
    },
  ];
}

const decided = (d: Decision) => (d.status === "pending" ? { decidedBy: null, decidedAt: null, decisionReason: null } : { decidedBy: MODERATOR, decidedAt: d.at, decisionReason: d.status === "declined" ? d.reason : null });

/** Inserts the demo applications that are missing, with their audit entries; returns how many. */
export async function seedApplications(tx: SeedTx, clock: DemoClock): Promise<number> {
  let inserted = 0;
  for (const a of demoSellerApplications(clock)) {
    const id = demoUuid("seller-application", a.n);
    const rows = await tx
      .insert(schema.sellerApplications)
      .values({ id, userId: a.userId, shopName: a.shopName, profileMd: a.profileMd, country: a.country, returnsPolicyMd: a.returnsPolicyMd, returnsWindowDays: a.returnsWindowDays, status: a.decision.status, ...decided(a.decision), createdAt: a.at })
      .onConflictDoNothing()
      .returning({ id: schema.sellerApplications.id });
    if (rows.length === 0) continue;
    inserted += 1;
    const audit: SeedAudit[] = [{ at: a.at, actorId: a.userId, action: "seller_application.submitted", subjectType: "seller_application", subjectId: id, details: { shopName: a.shopName, country: a.country } }];
    if (a.decision.status === "declined") {
      audit.push({ at: a.decision.at, actorId: MODERATOR, action: "seller.declined", subjectType: "seller_application", subjectId: id, reason: a.decision.reason, details: { userId: a.userId, shopName: a.shopName } });
    }
    await seedAudit(tx, audit);
  }
  for (const a of demoReviewerApplications(clock)) {
    const id = demoUuid("reviewer-application", a.n);
    const rows = await tx
      .insert(schema.reviewerApplications)
      .values({ id, userId: a.userId, expertise: a.expertise, profileMd: a.profileMd, trackRecordMd: a.trackRecordMd, priceMinor: a.priceMinor, currency: "EUR", status: a.decision.status, ...decided(a.decision), createdAt: a.at })
      .onConflictDoNothing()
      .returning({ id: schema.reviewerApplications.id });
    if (rows.length === 0) continue;
    inserted += 1;
    const audit: SeedAudit[] = [{ at: a.at, actorId: a.userId, action: "reviewer_application.submitted", subjectType: "reviewer_application", subjectId: id, details: { expertise: a.expertise, priceMinor: a.priceMinor } }];
    if (a.decision.status === "approved") {
      audit.push({ at: a.decision.at, actorId: MODERATOR, action: "reviewer.approved", subjectType: "reviewer_application", subjectId: id, details: { userId: a.userId, expertise: a.expertise, priceMinor: a.priceMinor } });
    }
    if (a.decision.status === "declined") {
      audit.push({ at: a.decision.at, actorId: MODERATOR, action: "reviewer.declined", subjectType: "reviewer_application", subjectId: id, reason: a.decision.reason, details: { userId: a.userId } });
    }
    await seedAudit(tx, audit);
  }
  return inserted;
}
