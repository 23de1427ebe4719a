// The demo's scope captures as the CSV files a bench scope saves: invented gate-drive signals, made
// by a small seeded generator so every run writes the same bytes. The seed measures these texts
// with the app's own functions; the same files are in public/demo/, where the capture's "original
// file" link points. `npx tsx db/seed-capture-files.ts` writes them there again after a change
// here (tests/integration/seed/demo-states.test.ts fails while the two differ).
//
// A pulse is a trapezoid: a linear rise over `riseS` from the low to the high level, high, a linear
// fall over `fallS`, low until the next period; the ramps are placed so the 50 % crossings are the
// duty cycle apart, which is how IEEE Std 181 defines pulse duration. Noise is Gaussian.
import { seededRandom } from "@/lib/random/seeded";
import { writeFileSync } from "node:fs";
import path from "node:path";

type Gate = { name: string; lowV: number; highV: number; delayS: number; seed: number };

type PulseRecord = {
  sampleRateHz: number;
  samples: number;
  /** time of the first sample (a scope puts the trigger at 0, so the record starts before it) */
  startS: number;
  frequencyHz: number;
  dutyCyclePct: number;
  riseS: number;
  fallS: number;
  noiseRmsV: number;
  gates: Gate[];
};


/** Standard normal samples by the Box–Muller transform (one of each pair is enough here). */
function gaussian(seed: number): () => number {
  const next = seededRandom(seed);
  return () => Math.sqrt(-2 * Math.log(Math.max(next(), Number.EPSILON))) * Math.cos(2 * Math.PI * next());
}

function trapezoid(t: number, record: PulseRecord, gate: Gate): number {
  const period = 1 / record.frequencyHz;
  const fallStart = record.riseS / 2 + (record.dutyCyclePct / 100) * period - record.fallS / 2;
  const phase = (((t - gate.delayS) % period) + period) % period;
  const swing = gate.highV - gate.lowV;
  if (phase < record.riseS) return gate.lowV + (swing * phase) / record.riseS;
  if (phase < fallStart) return gate.highV;
  if (phase < fallStart + record.fallS) return gate.highV - (swing * (phase - fallStart)) / record.fallS;
  return gate.lowV;
}

/** The record's rows: time in seconds to 7 significant digits, levels in volts to the millivolt. */
function rows(record: PulseRecord): string[] {
  const noise = record.gates.map((g) => gaussian(g.seed));
  const out: string[] = [];
  for (let i = 0; i < record.samples; i++) {
    const t = record.startS + i / record.sampleRateHz;
    const levels = record.gates.map((g, c) => (trapezoid(t, record, g) + record.noiseRmsV * noise[c]!()).toFixed(3));
    out.push([t.toExponential(6), ...levels].join(","));
  }
  return out;
}

function csv(lines: string[]): string {
  return lines.join("\r\n") + "\r\n";
}

function header(record: PulseRecord): string {
  return ["Time (s)", ...record.gates.map((g) => `${g.name} (V)`)].join(",");
}

// The yard kit's half-bridge: the two gates switch in turn, half a period apart, each a little under
// 50 % so there is dead time between them (the kit expects 38–42 kHz and 40–48 %).
const FIRST_BOARD: PulseRecord = {
  sampleRateHz: 20e6,
  samples: 4_000,
  startS: -100e-6,
  frequencyHz: 40.1e3,
  dutyCyclePct: 46,
  riseS: 300e-9,
  fallS: 220e-9,
  noiseRmsV: 0.04,
  gates: [
    { name: "Q1 gate", lowV: 0, highV: 15, delayS: 1.5e-6, seed: 401 },
    { name: "Q2 gate", lowV: 0, highV: 14.8, delayS: 1.5e-6 + 0.5 / 40.1e3, seed: 402 },
  ],
};

const SECOND_BOARD: PulseRecord = {
  ...FIRST_BOARD,
  frequencyHz: 37.1e3,
  dutyCyclePct: 44,
  gates: [
    { name: "Q1 gate", lowV: 0, highV: 15.1, delayS: 2e-6, seed: 371 },
    { name: "Q2 gate", lowV: 0, highV: 14.9, delayS: 2e-6 + 0.5 / 37.1e3, seed: 372 },
  ],
};

const SCOPE = "Instrument,Bench scope";

export type DemoCaptureFile = { file: string; text: string };

/** Where the measured capture's first gate crosses 50 % just after the trigger: rising, then falling. */
export function firstBoardEdges(): { q1RiseS: number; q1FallS: number; q2RiseS: number } {
  const [q1, q2] = FIRST_BOARD.gates as [Gate, Gate];
  const q1RiseS = q1.delayS + FIRST_BOARD.riseS / 2;
  return { q1RiseS, q1FallS: q1RiseS + FIRST_BOARD.dutyCyclePct / 100 / FIRST_BOARD.frequencyHz, q2RiseS: q2.delayS + FIRST_BOARD.riseS / 2 };
}

/** The measured capture: log 1's gate drive at the 40.1 kHz and 46 % its readings say. */
export function firstBoardGateDrive(): DemoCaptureFile {
  return { file: "scope-gate-drive.csv", text: csv([SCOPE, "Probe,x10", header(FIRST_BOARD), ...rows(FIRST_BOARD)]) };
}

/**
 * A file the parser refuses: the scope's "append" save mode wrote a second acquisition under the
 * first without a header, so the time column starts again from the beginning part-way down.
 */
export function appendedRecords(): DemoCaptureFile {
  const record: PulseRecord = { ...FIRST_BOARD, samples: 800, startS: -20e-6, gates: [FIRST_BOARD.gates[0]!] };
  const second: PulseRecord = { ...record, gates: [{ ...FIRST_BOARD.gates[0]!, seed: 403 }] };
  return { file: "scope-gate-duty-appended.csv", text: csv([SCOPE, "Probe,x10", header(record), ...rows(record), ...rows(second)]) };
}

/** The second board's gate drive, waiting for the worker. */
export function secondBoardGateDrive(): DemoCaptureFile {
  return { file: "scope-second-board-gate-drive.csv", text: csv([SCOPE, "Probe,x10", header(SECOND_BOARD), ...rows(SECOND_BOARD)]) };
}

/** A longer record of the second board's first gate, being measured. */
export function secondBoardLongRecord(): DemoCaptureFile {
  const record: PulseRecord = { ...SECOND_BOARD, sampleRateHz: 10e6, samples: 6_000, startS: -300e-6, gates: [SECOND_BOARD.gates[0]!] };
  return { file: "scope-second-board-long-record.csv", text: csv([SCOPE, "Probe,x10", header(record), ...rows(record)]) };
}

export const DEMO_CAPTURE_FILES = [firstBoardGateDrive, appendedRecords, secondBoardGateDrive, secondBoardLongRecord];

if (import.meta.url === `file://${process.argv[1]}`) {
  const dir = path.resolve(import.meta.dirname, "../public/demo");
  for (const make of DEMO_CAPTURE_FILES) {
    const { file, text } = make();
    writeFileSync(path.join(dir, file), text);
    console.log(`wrote public/demo/${file} (${Buffer.byteLength(text)} bytes)`);
  }
}
