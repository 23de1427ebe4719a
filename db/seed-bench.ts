// Bring-up logs of the demo's builders, with readings within, low and high (some far outside) of each
// checkpoint's expected range, photos of the bench at a few of them, public and private logs. The
// verdicts are the engineering core's own (lib/engineering classifyReading), not written by hand.
import { asc, eq } from "drizzle-orm";
import { classifyReading } from "@/lib/engineering";
import * as schema from "./schema";
import { demoUuid, type DemoClock, type SeedTx } from "./seed-support";

const KIT = "0b7d1c3e-5a21-4c6e-9f10-000000000001";

type ReadingSpec = {
  checkpoint: string;
  value: number;
  /** as typed, when the builder typed another unit than the checkpoint's */
  entered?: { value: number; unit: string };
  instrument?: string;
  note?: string;
  /** days after the log was started */
  day: number;
  photo?: { file: string; caption: string; width: number; height: number };
};

type OwnCheckpoint = { stage: schema.BringUpStage; name: string; measure: string; unit: string; min: number; max: number };

export type DemoLog = {
  n: number;
  ownerId: string;
  title: string;
  notesMd: string;
  visibility: "private" | "public";
  /** a kit's checkpoints copied in, or the builder's own */
  from: { kit: string } | { own: OwnCheckpoint[] };
  startedDaysAgo: number;
  readings: ReadingSpec[];
};

const SCOPE = { file: "bench-scope-gate-drive", caption: "Gate-drive transformer primary on the scope, 10 µs per division", width: 1200, height: 800 };
const METER = { file: "bench-meter-bus", caption: "Meter across the bus terminals with the series lamp in circuit", width: 1200, height: 800 };
const LAMP = { file: "bench-series-lamp", caption: "The 100 W series lamp glowing dimly at idle", width: 1200, height: 800 };

export const DEMO_LOGS: DemoLog[] = [
  {
    n: 1,
    ownerId: "demo-builder",
    title: "Stick welder from the yard kit",
    notesMd:
      "Built from the **160 A kit** over three evenings at the yard bench. Series lamp: 100 W incandescent in a fused box.\n\nThe open-circuit output read high at first: the transformer's secondary was on the wrong tap. Re-measured after moving it.",
    visibility: "public",
    from: { kit: KIT },
    startedDaysAgo: 31,
    readings: [
      { checkpoint: "Gate-drive frequency", value: 40.1, entered: { value: 40_100, unit: "Hz" }, instrument: "Bench scope, ×10 probe", day: 1, photo: SCOPE, note: "Clean edges, no ringing to speak of." },
      { checkpoint: "Gate-drive duty cycle", value: 46, instrument: "Bench scope", day: 1 },
      { checkpoint: "Control supply current", value: 68, instrument: "Bench supply's own meter", day: 1, note: "The bench supply's current limit was set to 100 mA; the board may want more at start-up." },
      { checkpoint: "Bus voltage behind the lamp", value: 318.2, instrument: "Handheld meter, CAT III", day: 2, photo: METER, note: "Lamp flashed, then went dark." },
      { checkpoint: "Open-circuit output", value: 71, instrument: "Handheld meter", day: 2, note: "Too high: the secondary is on the wrong tap?" },
      { checkpoint: "Idle input current", value: 0.31, entered: { value: 310, unit: "mA" }, instrument: "Clamp meter", day: 2, photo: LAMP },
      { checkpoint: "Open-circuit output", value: 63, instrument: "Handheld meter", day: 4, note: "After moving the secondary to the right tap." },
    ],
  },
  {
    n: 2,
    ownerId: "demo-builder",
    title: "Stick welder, second board",
    notesMd: "A second main board from the same kit, for the cooperative's loan shelf. Private until it passes the lamp test.",
    visibility: "private",
    from: { kit: KIT },
    startedDaysAgo: 70,
    readings: [
      { checkpoint: "Gate-drive frequency", value: 37.1, instrument: "Bench scope", day: 1, note: "A little slow; the timing capacitor is a 5 % part." },
      { checkpoint: "Gate-drive duty cycle", value: 44, instrument: "Bench scope", day: 1 },
      { checkpoint: "Control supply current", value: 128, instrument: "Bench supply's own meter", day: 1 },
      { checkpoint: "Bus voltage behind the lamp", value: 341, instrument: "Handheld meter, CAT III", day: 3, note: "Mains was high this evening." },
    ],
  },
  {
    n: 3,
    ownerId: "demo-builder-2",
    title: "Induction heater, own design",
    notesMd: "A 1.5 kW series-resonant heater on a half-bridge, my own layout. The checkpoints are mine, from the design's simulation with a margin either side.",
    visibility: "private",
    from: {
      own: [
        { stage: "control-supply", name: "Driver supply current", measure: "Current from the 15 V bench supply", unit: "mA", min: 60, max: 120 },
        { stage: "control-supply", name: "Gate-drive frequency", measure: "Frequency at the gate-drive transformer", unit: "kHz", min: 28, max: 34 },
        { stage: "series-lamp", name: "Bus voltage behind the lamp", measure: "DC bus voltage with the 100 W series lamp in circuit", unit: "V", min: 290, max: 335 },
        { stage: "series-lamp", name: "Idle input current", measure: "Mains current with no workpiece", unit: "A", min: 0.05, max: 0.5 },
        { stage: "low-current", name: "Work coil current, no load", measure: "Coil current with the power dial at its lowest", unit: "A", min: 5, max: 15 },
        { stage: "rated-load", name: "Tank capacitor temperature", measure: "Capacitor bank temperature after 5 min at full power", unit: "°C", min: 20, max: 60 },
      ],
    },
    startedDaysAgo: 45,
    readings: [
      { checkpoint: "Driver supply current", value: 88, instrument: "Bench supply's own meter", day: 1 },
      { checkpoint: "Gate-drive frequency", value: 30.6, instrument: "Bench scope", day: 1, photo: SCOPE },
      { checkpoint: "Bus voltage behind the lamp", value: 352, instrument: "Handheld meter, CAT III", day: 2, note: "Far above what I expected: is the bus capacitor rated for this?" },
      { checkpoint: "Idle input current", value: 0.22, instrument: "Clamp meter", day: 2 },
      { checkpoint: "Work coil current, no load", value: 3.2, instrument: "Current probe", day: 3, note: "Low: the tank may be off resonance." },
    ],
  },
  {
    n: 4,
    ownerId: "demo-builder-2",
    title: "Stick welder kit, bench two",
    notesMd: "The yard kit, built for the cooperative's second welding bench. Every stage measured, up to rated load.",
    visibility: "public",
    from: { kit: KIT },
    startedDaysAgo: 60,
    readings: [
      { checkpoint: "Gate-drive frequency", value: 39.8, instrument: "Bench scope", day: 1 },
      { checkpoint: "Gate-drive duty cycle", value: 45, instrument: "Bench scope", day: 1 },
      { checkpoint: "Control supply current", value: 104, instrument: "Bench supply's own meter", day: 1 },
      { checkpoint: "Bus voltage behind the lamp", value: 322, instrument: "Handheld meter, CAT III", day: 2 },
      { checkpoint: "Open-circuit output", value: 64, instrument: "Handheld meter", day: 2 },
      { checkpoint: "Idle input current", value: 0.12, instrument: "Clamp meter", day: 2 },
      { checkpoint: "Current-limit response", value: 24, instrument: "Shunt and meter", day: 3 },
      { checkpoint: "Primary heatsink temperature", value: 81, instrument: "Thermocouple", day: 4, note: "Warmer than the kit expects; the fan was on its low setting." },
      { checkpoint: "Maximum output current", value: 158, instrument: "Shunt and meter", day: 4 },
    ],
  },
];

export const logId = (n: number) => demoUuid("log", n);
export const logCheckpointId = (log: number, position: number) => demoUuid("log-checkpoint", log * 100 + position);
/** The reading at `index` of a demo log's `readings`. */
export const readingId = (log: number, index: number) => demoUuid("reading", log * 100 + index);

const DAY_MS = 24 * 60 * 60 * 1000;

/** Inserts the demo logs that are missing with their checkpoints, readings and photos; returns how many. */
export async function seedBench(tx: SeedTx, clock: DemoClock): Promise<number> {
  let inserted = 0;
  for (const log of DEMO_LOGS) {
    const started = clock.ago(log.startedDaysAgo);
    const lastDay = Math.max(0, ...log.readings.map((r) => r.day));
    const rows = await tx
      .insert(schema.bringUpLogs)
      .values({
        id: logId(log.n),
        ownerId: log.ownerId,
        kitListingId: "kit" in log.from ? log.from.kit : null,
        title: log.title,
        notesMd: log.notesMd,
        visibility: log.visibility,
        createdAt: started,
        updatedAt: new Date(started.getTime() + lastDay * DAY_MS),
      })
      .onConflictDoNothing()
      .returning({ id: schema.bringUpLogs.id });
    if (rows.length === 0) continue;
    inserted += 1;

    const source =
      "kit" in log.from
        ? (await tx.select().from(schema.listingCheckpoints).where(eq(schema.listingCheckpoints.listingId, log.from.kit)).orderBy(asc(schema.listingCheckpoints.position))).map((c) => ({
            sourceCheckpointId: c.id,
            stage: c.stage,
            name: c.name,
            measure: c.measure,
            unit: c.unit,
            min: c.expectedMin,
            max: c.expectedMax,
            addedByBuilder: false,
          }))
        : log.from.own.map((c) => ({ ...c, sourceCheckpointId: null, addedByBuilder: true }));
    const checkpoints = source.map((c, position) => ({ id: logCheckpointId(log.n, position), position, ...c }));
    await tx.insert(schema.logCheckpoints).values(
      checkpoints.map((c) => ({
        id: c.id,
        logId: logId(log.n),
        sourceCheckpointId: c.sourceCheckpointId,
        position: c.position,
        stage: c.stage,
        name: c.name,
        measure: c.measure,
        unit: c.unit,
        expectedMin: c.min,
        expectedMax: c.max,
        addedByBuilder: c.addedByBuilder,
      })),
    );

    for (const [i, r] of log.readings.entries()) {
      const checkpoint = checkpoints.find((c) => c.name === r.checkpoint);
      if (!checkpoint) throw new Error(`demo log ${log.n} has no checkpoint “${r.checkpoint}”`);
      const verdict = classifyReading({ value: r.value, min: checkpoint.min, max: checkpoint.max });
      const id = readingId(log.n, i);
      // Readings of one evening a few minutes apart, in the order they are listed.
      const takenAt = new Date(started.getTime() + r.day * DAY_MS + i * 7 * 60_000);
      await tx.insert(schema.readings).values({
        id,
        logId: logId(log.n),
        checkpointId: checkpoint.id,
        value: r.value,
        enteredValue: r.entered?.value ?? r.value,
        enteredUnit: r.entered?.unit ?? checkpoint.unit,
        verdict: verdict.verdict,
        farOutside: verdict.farOutside,
        instrument: r.instrument ?? "",
        note: r.note ?? "",
        takenAt,
      });
      if (r.photo) {
        const key = `demo-${r.photo.file}-${log.n}-${i}`;
        await tx.insert(schema.uploads).values({
          key,
          ownerId: log.ownerId,
          purpose: "reading-photo",
          originalName: `${r.photo.file}.jpg`,
          contentType: "image/webp",
          bytes: 14_000,
          url: `/demo/${r.photo.file}.webp`,
          thumbUrl: `/demo/${r.photo.file}-thumb.webp`,
          width: r.photo.width,
          height: r.photo.height,
          createdAt: takenAt,
        });
        await tx.insert(schema.readingPhotos).values({ id: demoUuid("reading-photo", log.n * 100 + i), readingId: id, uploadKey: key, position: 0, caption: r.photo.caption });
      }
    }
  }
  return inserted;
}
