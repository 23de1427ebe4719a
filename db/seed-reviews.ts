// Paid review sessions of the demo's bring-up logs, one in each state: requested (held, waiting for
// the reviewer), accepted, delivered with a report and a verdict per checkpoint, closed after the
// dispute window, declined, expired, disputed and waiting for a moderator, and closed by a moderator
// with each outcome (the payment stands, refunded in full, refunded in part). Money follows
// lib/reviews/money.ts and the deadlines lib/reviews/transitions.ts.
import { refundParts, reviewerShareDue, reviewSplit } from "@/lib/reviews/money";
import { disputeByFrom, respondByFrom } from "@/lib/reviews/transitions";
import * as schema from "./schema";
import { DEMO_REVIEWER } from "./seed-data";
import { DEMO_LOGS, logCheckpointId, logId } from "./seed-bench";
import { DEMO_LISTINGS } from "./seed-listings";
import { DEMO_FEE_BPS } from "./seed-orders";
import { demoUuid, seedAudit, type DemoClock, type SeedAudit, type SeedTx } from "./seed-support";

const REVIEWER = DEMO_REVIEWER.userId;
const MODERATOR = "demo-moderator";

type Verdicts = Record<string, [schema.CheckpointVerdict, string]>;

type SessionSpec = {
  n: number;
  log: number;
  stages: schema.BringUpStage[];
  state: schema.ReviewState;
  message: string;
  created: Date;
  accepted?: Date;
  declined?: { at: Date; reason: string };
  expired?: Date;
  delivered?: { at: Date; summaryMd: string; verdicts: Verdicts };
  dispute?: { at: Date; reason: string; outcome: (typeof schema.DISPUTE_OUTCOMES)[number]; refundMinor?: number; decidedAt?: Date; note?: string };
};

export function demoSessions({ ago }: DemoClock): SessionSpec[] {
  return [
    {
      n: 1,
      log: 2,
      stages: ["control-supply", "series-lamp"],
      state: "requested",
      message: "The gate-drive frequency reads low at 37.1 kHz. Is the timing capacitor worth changing before I go on to the lamp test again?",
      created: ago(0, 5),
    },
    {
      n: 2,
      log: 3,
      stages: ["control-supply", "series-lamp", "low-current"],
      state: "accepted",
      message: "The bus reads 352 V behind the lamp, far above what I designed for, and the coil current is low. I do not trust either yet.",
      created: ago(2),
      accepted: ago(1, 20),
    },
    {
      n: 3,
      log: 1,
      stages: ["control-supply", "series-lamp"],
      state: "delivered",
      message: "Everything but the control supply current looks right to me; please look at the series-lamp stage closely.",
      created: ago(6),
      accepted: ago(5, 20),
      delivered: {
        at: ago(2),
        summaryMd:
          "A careful bring-up. The control side is healthy; **raise the bench supply's current limit** and measure the control current again before you blame the board.\n\nBehind the lamp everything reads as it should now that the transformer is on the right tap.",
        verdicts: {
          "Gate-drive frequency": ["fine", "40.1 kHz sits in the middle of the range, and the edges in your capture are clean."],
          "Gate-drive duty cycle": ["fine", ""],
          "Control supply current": ["needs_attention", "68 mA is under the kit's 80 mA: set the bench supply's limit to 200 mA and measure again."],
          "Bus voltage behind the lamp": ["fine", "318 V behind a 100 W lamp is what a healthy bus reads."],
          "Open-circuit output": ["fine", "63 V after the tap change is right; the first 71 V was the wrong tap."],
          "Idle input current": ["fine", ""],
        },
      },
    },
    {
      n: 4,
      log: 4,
      stages: ["control-supply", "series-lamp"],
      state: "closed",
      message: "A second bench for the cooperative; I would like a second pair of eyes before it goes to rated load.",
      created: ago(26),
      accepted: ago(25),
      delivered: {
        at: ago(21),
        summaryMd: "Nothing to fix in these two stages. Go on to the low-current load with the lamp still in circuit.",
        verdicts: {
          "Gate-drive frequency": ["fine", ""],
          "Gate-drive duty cycle": ["fine", ""],
          "Control supply current": ["fine", ""],
          "Bus voltage behind the lamp": ["fine", ""],
          "Open-circuit output": ["fine", "64 V, inside the kit's range and well under the limit for a normal environment."],
          "Idle input current": ["fine", ""],
        },
      },
    },
    {
      n: 5,
      log: 4,
      stages: ["rated-load"],
      state: "declined",
      message: "The heatsink runs warm at rated load.",
      created: ago(31),
      declined: { at: ago(30), reason: "I am away from the bench until the end of the month; please book someone else, or ask me again then." },
    },
    {
      n: 6,
      log: 2,
      stages: ["control-supply"],
      state: "expired",
      message: "First look at the second board's control side, please.",
      created: ago(12),
      expired: ago(10),
    },
    {
      n: 7,
      log: 1,
      stages: ["series-lamp"],
      state: "disputed",
      message: "Only the series-lamp stage, please: is the open-circuit output right now?",
      created: ago(14),
      accepted: ago(13),
      delivered: {
        at: ago(9),
        summaryMd: "The bus is fine. **Do not load it yet**: the open-circuit output is above the kit's range.",
        verdicts: {
          "Bus voltage behind the lamp": ["fine", ""],
          "Open-circuit output": ["stop", "71 V open circuit is above the 66 V the kit allows; check the transformer tap before any load."],
          "Idle input current": ["fine", ""],
        },
      },
      dispute: { at: ago(4), reason: "The stop verdict is for the 71 V reading I had already fixed; the 63 V reading after the tap change is in the log above it.", outcome: "open" },
    },
    {
      n: 8,
      log: 4,
      stages: ["low-current", "rated-load"],
      state: "closed",
      message: "How hot may the primary heatsink get, and is the fan enough?",
      created: ago(45),
      accepted: ago(44),
      delivered: {
        at: ago(40),
        summaryMd: "The current limit and the maximum current are right. The heatsink runs too warm: run the fan at full speed or fit a second one, and aim for under 75 °C after five minutes at 120 A.",
        verdicts: {
          "Current-limit response": ["fine", ""],
          "Primary heatsink temperature": ["needs_attention", "81 °C after five minutes at 120 A; aim for under 75 °C."],
          "Maximum output current": ["fine", ""],
        },
      },
      dispute: {
        at: ago(38),
        reason: "I asked whether the fan is enough and the report only says to run it faster.",
        outcome: "closed_payment_stands",
        decidedAt: ago(35),
        note: "The report answers the question that was asked, with a temperature to aim for; the payment stands.",
      },
    },
    {
      n: 9,
      log: 2,
      stages: ["control-supply"],
      state: "closed",
      message: "Is the second board's control side ready for the lamp?",
      created: ago(58),
      accepted: ago(57),
      delivered: {
        at: ago(53),
        summaryMd: "The frequency at 42 kHz is at the top of the range; the rest is fine.",
        verdicts: {
          "Gate-drive frequency": ["needs_attention", "42 kHz is at the top of the range; check the timing resistor."],
          "Gate-drive duty cycle": ["fine", ""],
          "Control supply current": ["fine", ""],
        },
      },
      dispute: {
        at: ago(51),
        reason: "The report talks about a 42 kHz reading; my log shows 37.1 kHz.",
        outcome: "refunded_full",
        refundMinor: DEMO_REVIEWER.priceMinor,
        decidedAt: ago(48),
        note: "The comments describe readings that are not in this log; refunded in full.",
      },
    },
    {
      n: 10,
      log: 3,
      stages: ["control-supply"],
      state: "closed",
      message: "A first look at my own driver board.",
      created: ago(30),
      accepted: ago(29),
      delivered: {
        at: ago(27),
        summaryMd: "Both control-side readings are where your design puts them. The note about the snubber applies to a forward converter, not to your half-bridge; ignore it.",
        verdicts: {
          "Driver supply current": ["fine", ""],
          "Gate-drive frequency": ["fine", "30.6 kHz; check it again with the tank connected, since the load pulls it."],
        },
      },
      dispute: {
        at: ago(25),
        reason: "Half the report is about a board I do not have.",
        outcome: "refunded_partial",
        refundMinor: 1500,
        decidedAt: ago(22),
        note: "The verdicts are sound; a third goes back for the comments that were about another build.",
      },
    },
  ];
}

export const sessionId = (n: number) => demoUuid("review-session", n);
export const REVIEW_PLACEHOLDER = {
  paymentIntent: (n: number) => `pi_seed_review_${n}`,
  transfer: (n: number) => `tr_seed_review_${n}`,
  refund: (n: number) => `re_seed_review_${n}`,
  reversal: (n: number) => `trr_seed_review_${n}`,
};

const MINUTE = 60_000;
const SETTLE_WORDS = { closed_payment_stands: "payment_stands", refunded_full: "refund_full", refunded_partial: "refund_partial" } as const;

/** Inserts the demo review sessions that are missing, with their reports, verdicts and disputes; returns how many. */
export async function seedReviews(tx: SeedTx, clock: DemoClock): Promise<number> {
  let inserted = 0;
  for (const s of demoSessions(clock)) {
    const log = DEMO_LOGS.find((l) => l.n === s.log)!;
    const builderId = log.ownerId;
    const priceMinor = DEMO_REVIEWER.priceMinor;
    const split = reviewSplit(priceMinor, DEMO_FEE_BPS);
    const id = sessionId(s.n);
    const audit: SeedAudit[] = [];
    const entry = (at: Date, actorId: string | null, action: string, details: Record<string, unknown>, reason?: string) =>
      audit.push({ at, actorId, action, subjectType: "review_session", subjectId: id, reason: reason ?? null, details });

    entry(s.created, builderId, "review.booked", { logId: logId(s.log), reviewerId: REVIEWER, stages: s.stages, priceMinor, feeMinor: split.feeMinor, paymentIntentId: REVIEW_PLACEHOLDER.paymentIntent(s.n) });
    let state: schema.ReviewState = "requested";
    let closedAt: Date | null = null;
    let releasedAt: Date | null = null;
    let capturedAt: Date | null = null;
    let transferId: string | null = null;
    let disputeBy: Date | null = null;
    let refundedMinor = 0;
    if (s.accepted) {
      entry(s.accepted, REVIEWER, "review.accepted", { from: state, to: "accepted" });
      state = "accepted";
    }
    if (s.declined) {
      entry(s.declined.at, REVIEWER, "review.declined", { from: state, to: "declined" }, s.declined.reason);
      state = "declined";
      closedAt = s.declined.at;
    }
    if (s.expired) {
      entry(s.expired, null, "review.expired", { from: state, to: "expired" });
      state = "expired";
      closedAt = s.expired;
    }
    if (state === "declined" || state === "expired") {
      releasedAt = new Date(closedAt!.getTime() + MINUTE);
      entry(releasedAt, null, "review.payment_released", { paymentIntentId: REVIEW_PLACEHOLDER.paymentIntent(s.n), state });
    }
    if (s.delivered) {
      const tally = (v: schema.CheckpointVerdict) => Object.values(s.delivered!.verdicts).filter(([x]) => x === v).length;
      entry(s.delivered.at, REVIEWER, "review.delivered", { from: state, to: "delivered", fine: tally("fine"), needsAttention: tally("needs_attention"), stop: tally("stop") });
      state = "delivered";
      disputeBy = disputeByFrom(s.delivered.at);
      capturedAt = new Date(s.delivered.at.getTime() + MINUTE);
      entry(capturedAt, null, "review.payment_captured", { paymentIntentId: REVIEW_PLACEHOLDER.paymentIntent(s.n), amountMinor: priceMinor });
      transferId = REVIEW_PLACEHOLDER.transfer(s.n);
      entry(capturedAt, null, "review.share_transferred", { transferId, amountMinor: reviewerShareDue({ priceMinor, feeMinor: split.feeMinor, reviewerShareMinor: split.reviewerShareMinor, refundedMinor: 0 }) });
    }
    const disputeId = demoUuid("review-dispute", s.n);
    if (s.dispute) {
      entry(s.dispute.at, builderId, "review.disputed", { from: state, to: "disputed", disputeId }, s.dispute.reason);
      state = "disputed";
      if (s.dispute.outcome !== "open") {
        const refundMinor = s.dispute.refundMinor ?? 0;
        const parts = refundMinor > 0 ? refundParts({ priceMinor, feeMinor: split.feeMinor, refundedMinor: 0 }, refundMinor) : { feeMinor: 0, reviewerMinor: 0 };
        entry(
          s.dispute.decidedAt!,
          MODERATOR,
          "review.dispute_settled",
          {
            from: state,
            to: "closed",
            disputeId,
            outcome: SETTLE_WORDS[s.dispute.outcome],
            refundMinor,
            feeRefundMinor: parts.feeMinor,
            reviewerRefundMinor: parts.reviewerMinor,
            refundId: refundMinor > 0 ? REVIEW_PLACEHOLDER.refund(s.n) : null,
            reversalId: refundMinor > 0 && parts.reviewerMinor > 0 ? REVIEW_PLACEHOLDER.reversal(s.n) : null,
          },
          s.dispute.note,
        );
        state = "closed";
        closedAt = s.dispute.decidedAt!;
        refundedMinor = refundMinor;
      }
    } else if (s.state === "closed" && disputeBy) {
      // No dispute within the window: the worker's sweep closed it when the window ended.
      entry(disputeBy, null, "review.closed", { from: state, to: "closed" });
      state = "closed";
      closedAt = disputeBy;
    }
    if (state !== s.state) throw new Error(`demo review session ${s.n} would end ${state}, not ${s.state}`);
    const updatedAt = [s.created, s.accepted, s.delivered?.at, closedAt, s.dispute?.at].filter((d): d is Date => d instanceof Date).reduce((a, b) => (a > b ? a : b));

    const rows = await tx
      .insert(schema.reviewSessions)
      .values({
        id,
        logId: logId(s.log),
        builderId,
        reviewerId: REVIEWER,
        stages: s.stages,
        state,
        priceMinor,
        currency: "EUR",
        feeBps: DEMO_FEE_BPS,
        feeMinor: split.feeMinor,
        reviewerShareMinor: split.reviewerShareMinor,
        paymentIntentId: REVIEW_PLACEHOLDER.paymentIntent(s.n),
        capturedAt,
        releasedAt,
        transferId,
        refundedMinor,
        message: s.message,
        respondBy: respondByFrom(s.created),
        acceptedAt: s.accepted ?? null,
        deliveredAt: s.delivered?.at ?? null,
        disputeBy,
        closedAt,
        createdAt: s.created,
        updatedAt,
      })
      .onConflictDoNothing()
      .returning({ id: schema.reviewSessions.id });
    if (rows.length === 0) continue;
    inserted += 1;

    if (s.delivered) {
      await tx.insert(schema.reviewReports).values({ sessionId: id, summaryMd: s.delivered.summaryMd, createdAt: s.delivered.at });
      const names = Object.keys(s.delivered.verdicts);
      const scope = checkpointsInScope(s.log, s.stages);
      // As deliverReport insists: one verdict for each checkpoint in the booked stages, and no other.
      if (names.length !== scope.length || names.some((name) => !scope.some((c) => c.name === name))) {
        throw new Error(`demo review ${s.n} must give a verdict for exactly ${scope.map((c) => c.name).join(", ")}`);
      }
      await tx.insert(schema.reviewVerdicts).values(
        names.map((name, i) => {
          const position = scope.find((c) => c.name === name)!.position;
          const [verdict, comment] = s.delivered!.verdicts[name]!;
          return { id: demoUuid("review-verdict", s.n * 100 + i), sessionId: id, checkpointId: logCheckpointId(s.log, position), verdict, comment };
        }),
      );
    }
    if (s.dispute) {
      await tx.insert(schema.reviewDisputes).values({
        id: disputeId,
        sessionId: id,
        reason: s.dispute.reason,
        outcome: s.dispute.outcome,
        refundMinor: s.dispute.refundMinor ?? null,
        decidedBy: s.dispute.outcome === "open" ? null : MODERATOR,
        decisionNote: s.dispute.note ?? null,
        decidedAt: s.dispute.decidedAt ?? null,
        createdAt: s.dispute.at,
      });
    }
    await seedAudit(tx, audit);
  }
  return inserted;
}

/** The log's checkpoints in the booked stages, with their positions: the kit's (db/seed-listings.ts) or the builder's own. */
function checkpointsInScope(log: number, stages: schema.BringUpStage[]): { name: string; position: number }[] {
  const spec = DEMO_LOGS.find((l) => l.n === log)!;
  const all = "own" in spec.from ? spec.from.own : (DEMO_LISTINGS.find((l) => "kit" in spec.from && l.id === spec.from.kit)?.checkpoints ?? []);
  return all.map((c, position) => ({ name: c.name, stage: c.stage, position })).filter((c) => stages.includes(c.stage));
}
