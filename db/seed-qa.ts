// The demo's moderated Q&A: questions and answers in every state (waiting for a moderator, visible,
// hidden by members' flags, removed by a moderator), votes, an accepted answer, open and resolved
// flags, and the moderators' audit entries. Who waits in pre-moderation follows lib/qa/rules.ts: a
// member's posts wait until two of them have been let through.
import { HIDE_AT_OPEN_FLAGS } from "@/lib/qa/rules";
import * as schema from "./schema";
import { logId } from "./seed-bench";
import { demoUuid, seedAudit, type DemoClock, type SeedAudit, type SeedTx } from "./seed-support";

const KIT = "0b7d1c3e-5a21-4c6e-9f10-000000000001";
const CHOKE = "0b7d1c3e-5a21-4c6e-9f10-000000000003";
const MODERATOR = "demo-moderator";

type Flag = { by: string; reason: string; at: Date; resolvedAt?: Date };

type PostSpec = {
  n: number;
  authorId: string;
  bodyMd: string;
  at: Date;
  state: schema.PostState;
  /** a moderator let it through from pre-moderation */
  approvedAt?: Date;
  removed?: { at: Date; reason: string };
  flags?: Flag[];
  /** a moderator kept it up and dismissed the flags */
  restoredAt?: Date;
  photo?: { file: string; width: number; height: number };
};

type AnswerSpec = PostSpec & { votes?: { by: string; value: 1 | -1 }[]; accepted?: boolean };
type QuestionSpec = PostSpec & { title: string; listingId?: string; log?: number; answers: AnswerSpec[] };

/** Some hours after a moment: a moderator's approval, a vote. */
const later = (at: Date, hours: number) => new Date(at.getTime() + hours * 3_600_000);

export function demoQuestions({ ago }: DemoClock): QuestionSpec[] {
  return [
    {
      n: 1,
      authorId: "demo-builder",
      title: "Idle input current through the series lamp: how much is too much?",
      bodyMd:
        "With the 100 W lamp in series my welder idles at **0.31 A** from the mains, and the lamp glows dimly. The kit's sheet allows up to 0.4 A.\n\nIs a dim glow at idle normal, or should it go fully dark? Photo of the lamp attached.",
      listingId: KIT,
      log: 1,
      at: ago(29),
      state: "visible",
      approvedAt: later(ago(29), 1),
      photo: { file: "bench-series-lamp", width: 1200, height: 800 },
      answers: [
        {
          n: 1,
          authorId: "demo-reviewer",
          bodyMd:
            "A dim glow at idle is normal: the magnetising current of the main transformer and the gate drive take a little power. What matters is that it does **not** stay bright. 0.31 A is inside the kit's range; go on.",
          at: ago(28),
          state: "visible",
          approvedAt: later(ago(28), 1),
          votes: [
            { by: "demo-builder", value: 1 },
            { by: "demo-builder-2", value: 1 },
          ],
          accepted: true,
        },
        {
          n: 2,
          authorId: "demo-seller-kits",
          bodyMd: "The kit's range comes from the ones we brought up at the yard: 0.05–0.4 A through the lamp. Yours is fine.",
          at: later(ago(28), 5),
          state: "visible",
          approvedAt: later(ago(28), 6),
          votes: [
            { by: "demo-builder-2", value: 1 },
            { by: "demo-seller-magnetics", value: 1 },
            { by: "demo-member-declined", value: -1 },
          ],
          flags: [{ by: "demo-member-declined", reason: "The seller is promoting his own kit.", at: later(ago(28), 9), resolvedAt: ago(27) }],
          restoredAt: ago(27),
        },
        { n: 3, authorId: "demo-builder-2", bodyMd: "Mine glowed the same at idle, about 0.12 A; it went dark only once the bus had charged fully.", at: ago(27), state: "visible", approvedAt: later(ago(27), 2) },
        {
          n: 4,
          authorId: "demo-member-declined",
          bodyMd: "Lift the earth wire from the case and the flicker goes away.",
          at: ago(26),
          state: "removed",
          removed: { at: later(ago(26), 1), reason: "Lifting the protective earth is dangerous and against the site's rules." },
        },
        { n: 5, authorId: "demo-applicant", bodyMd: "Does the lamp's wattage change what counts as normal here? I have a 60 W lamp.", at: ago(0, 2), state: "pending" },
      ],
    },
    {
      n: 2,
      authorId: "demo-builder-2",
      title: "How long should the resonant capacitor bank rest before I touch it?",
      bodyMd: "My heater has a 4 µF film bank in the tank and a 10 µF bus with a 100 kΩ bleeder. How long do I wait after switching off before I reach in?",
      log: 3,
      at: ago(20),
      state: "visible",
      approvedAt: later(ago(20), 1),
      answers: [
        {
          n: 6,
          authorId: "demo-seller-magnetics",
          bodyMd: "Work it out: 100 kΩ × 10 µF is 1 s, and from 358 V to 60 V takes about 1.8 time constants, so 2 s. Wait ten times that, then **check with a meter** across the bus before touching.",
          at: ago(19),
          state: "visible",
          approvedAt: later(ago(19), 1),
          votes: [{ by: "demo-builder-2", value: 1 }],
        },
        {
          n: 7,
          authorId: "demo-member-declined",
          bodyMd: "A bank that small discharges in a second, you can touch it right away.",
          at: ago(18),
          state: "hidden",
          approvedAt: later(ago(18), 1),
          flags: [
            { by: "demo-builder", reason: "Tells people to skip the meter check.", at: ago(17, 10) },
            { by: "demo-reviewer", reason: "Unsafe: the bleeder may be open, and only a meter tells.", at: ago(17, 6) },
            { by: "demo-seller-kits", reason: "Dangerous advice.", at: ago(17) },
          ],
        },
      ],
    },
    {
      n: 3,
      authorId: "demo-applicant",
      title: "Will the output choke take more ripple at 30 kHz?",
      bodyMd: "I would run the 20 µH choke at 30 kHz instead of 40 kHz. The ripple current goes up by a third; does the core still stay clear of saturation at 110 A?",
      listingId: CHOKE,
      at: ago(0, 3),
      state: "pending",
      answers: [],
    },
    {
      n: 4,
      authorId: "demo-member-declined",
      title: "Bleeder resistors just waste power: anyone running without one?",
      bodyMd: "The bleeder on my bus burns a couple of watts all the time. Has anyone left it out?",
      at: ago(2),
      state: "hidden",
      approvedAt: later(ago(2), 1),
      flags: [
        { by: "demo-builder", reason: "Encourages leaving out a safety part.", at: ago(1, 20) },
        { by: "demo-builder-2", reason: "A bus without a bleeder stays charged for hours.", at: ago(1, 12) },
        { by: "demo-seller-kits", reason: "Unsafe.", at: ago(1) },
      ],
      answers: [],
    },
    {
      n: 5,
      authorId: "demo-member-declined",
      title: "Surplus 1200 V IGBT modules, message me",
      bodyMd: "I have forty modules from a scrapped drive, cheap, no questions asked. Send me a message.",
      at: ago(10),
      state: "removed",
      removed: { at: later(ago(10), 2), reason: "Advertising outside the marketplace; parts are sold here through a seller's shop." },
      answers: [],
    },
    {
      n: 6,
      authorId: "demo-builder",
      title: "Which thermal pad between the primary heatsink and its standoffs?",
      bodyMd: "The primary heatsink sits at bus potential on insulated standoffs. Does it need a thermal pad under the switches as well, and which rating?",
      listingId: KIT,
      at: ago(8),
      state: "visible",
      approvedAt: later(ago(8), 2),
      flags: [{ by: "demo-member-declined", reason: "Off topic.", at: ago(7) }],
      answers: [
        {
          n: 8,
          authorId: "demo-seller-kits",
          bodyMd: "Yes: a silicone pad rated for at least 4 kV under each switch, since the tab is at bus potential too. The kit ships with them.",
          at: ago(7, 20),
          state: "visible",
          approvedAt: ago(7, 19),
        },
      ],
    },
    {
      n: 7,
      authorId: "demo-builder-2",
      title: "Does the series-lamp test still make sense on a 120 V supply?",
      bodyMd: "A friend wants to bring up the same kit on 120 V mains with a step-up transformer. Does the 100 W lamp still limit enough?",
      at: ago(1),
      state: "visible",
      answers: [],
    },
  ];
}

export const questionId = (n: number) => demoUuid("question", n);
export const answerId = (n: number) => demoUuid("answer", n);

function postWrites(kind: "question" | "answer", id: string, post: PostSpec, questionIdOfPost: string) {
  const audit: SeedAudit[] = [];
  const entry = (at: Date, actorId: string | null, action: string, details: Record<string, unknown>, reason?: string) =>
    audit.push({ at, actorId, action, subjectType: kind, subjectId: id, reason: reason ?? null, details: { ...details, questionId: questionIdOfPost } });
  if (post.approvedAt) entry(post.approvedAt, MODERATOR, `${kind}.approved`, { from: "pending", to: "visible", flagsResolved: 0 });
  const open = (post.flags ?? []).filter((f) => !f.resolvedAt);
  if (post.state === "hidden") {
    if (open.length < HIDE_AT_OPEN_FLAGS) throw new Error(`demo ${kind} ${id} is hidden with only ${open.length} open flags`);
    const last = open.reduce((a, b) => (a.at > b.at ? a : b));
    entry(last.at, null, `${kind}.hidden`, { from: "visible", to: "hidden", openFlags: open.length, lastFlagBy: last.by }, `${open.length} open flags`);
  } else if (open.length >= HIDE_AT_OPEN_FLAGS) {
    throw new Error(`demo ${kind} ${id} has ${open.length} open flags but is not hidden`);
  }
  if (post.restoredAt) entry(post.restoredAt, MODERATOR, `${kind}.restored`, { from: "visible", to: "visible", flagsResolved: (post.flags ?? []).filter((f) => f.resolvedAt).length });
  if (post.removed) entry(post.removed.at, MODERATOR, `${kind}.removed`, { from: post.approvedAt ? "visible" : "pending", to: "removed", flagsResolved: 0 }, post.removed.reason);
  const flags = (post.flags ?? []).map((f, i) => ({
    id: demoUuid(`${kind}-flag:${id}`, i),
    postKind: kind,
    postId: id,
    flaggerId: f.by,
    reason: f.reason,
    resolvedAt: f.resolvedAt ?? null,
    createdAt: f.at,
  }));
  const updatedAt = [post.at, post.approvedAt, post.removed?.at, post.restoredAt, ...(post.flags ?? []).map((f) => f.at)].filter((d): d is Date => d instanceof Date).reduce((a, b) => (a > b ? a : b));
  return { audit, flags, updatedAt };
}

/** Inserts the demo questions that are missing, with their answers, votes, flags and photos; returns how many. */
export async function seedQa(tx: SeedTx, clock: DemoClock): Promise<number> {
  let inserted = 0;
  for (const q of demoQuestions(clock)) {
    const qid = questionId(q.n);
    const accepted = q.answers.find((a) => a.accepted);
    const question = postWrites("question", qid, q, qid);
    const rows = await tx
      .insert(schema.questions)
      .values({
        id: qid,
        authorId: q.authorId,
        listingId: q.listingId ?? null,
        logId: q.log ? logId(q.log) : null,
        title: q.title,
        bodyMd: q.bodyMd,
        state: q.state,
        acceptedAnswerId: accepted ? answerId(accepted.n) : null,
        removalReason: q.removed?.reason ?? null,
        createdAt: q.at,
        updatedAt: question.updatedAt,
      })
      .onConflictDoNothing()
      .returning({ id: schema.questions.id });
    if (rows.length === 0) continue;
    inserted += 1;
    const audit = [...question.audit];
    const flags = [...question.flags];
    if (q.photo) await attachPhoto(tx, "question", qid, q.authorId, q.photo, q.at);
    for (const a of q.answers) {
      const aid = answerId(a.n);
      const writes = postWrites("answer", aid, a, qid);
      const score = (a.votes ?? []).reduce((sum, v) => sum + v.value, 0);
      await tx.insert(schema.answers).values({ id: aid, questionId: qid, authorId: a.authorId, bodyMd: a.bodyMd, state: a.state, score, removalReason: a.removed?.reason ?? null, createdAt: a.at, updatedAt: writes.updatedAt });
      if (a.votes?.length) {
        await tx.insert(schema.answerVotes).values(a.votes.map((v, i) => ({ answerId: aid, voterId: v.by, value: v.value, createdAt: new Date(a.at.getTime() + (i + 1) * 3_600_000) })));
      }
      if (a.photo) await attachPhoto(tx, "answer", aid, a.authorId, a.photo, a.at);
      audit.push(...writes.audit);
      flags.push(...writes.flags);
    }
    if (flags.length > 0) await tx.insert(schema.postFlags).values(flags);
    await seedAudit(tx, audit);
  }
  return inserted;
}

async function attachPhoto(tx: SeedTx, kind: "question" | "answer", postId: string, ownerId: string, photo: NonNullable<PostSpec["photo"]>, at: Date) {
  const key = `demo-${kind}-${photo.file}-${postId.slice(0, 8)}`;
  await tx.insert(schema.uploads).values({
    key,
    ownerId,
    // Q&A photos are uploaded through the reading-photo route (lib/qa/posting.ts).
    purpose: "reading-photo",
    originalName: `${photo.file}.jpg`,
    contentType: "image/webp",
    bytes: 14_000,
    url: `/demo/${photo.file}.webp`,
    thumbUrl: `/demo/${photo.file}-thumb.webp`,
    width: photo.width,
    height: photo.height,
    createdAt: at,
  });
  await tx.insert(schema.postPhotos).values({ id: demoUuid(`${kind}-photo:${postId}`, 0), postKind: kind, postId, uploadKey: key, position: 0 });
}
