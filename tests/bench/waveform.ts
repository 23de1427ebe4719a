// Parsing and measuring a long oscilloscope capture: a 1,000,000-sample, two-channel CSV (a 20 kHz
// gate drive with finite edges and noise, and a second channel at half scale) parsed and measured
// five times; the median times, the ratio of measure to parse, and the memory it took.
// Run alone: `npx tsx tests/bench/waveform.ts`, or `npm run bench -- waveform`.
import { fileURLToPath } from "node:url";
import { downsampleForPlot, measurePulses, parseCaptureCsv } from "@/lib/engineering";

const SAMPLES = 1_000_000;
const RUNS = 5;

export type WaveformFigures = {
  samples: number;
  channels: number;
  fileMegabytes: number;
  parseMs: number;
  measureMs: number;
  downsampleMs: number;
  measureToParseRatio: number;
  parseAndMeasureMs: number;
  targetMs: number;
  heapGrowthMegabytes: number;
  peakRssMegabytes: number;
  frequencyHz: number | null;
  dutyCyclePct: number | null;
};

export async function runWaveformBench(): Promise<WaveformFigures> {
  const text = buildCapture(SAMPLES);
  const parse: number[] = [];
  const measure: number[] = [];
  const downsample: number[] = [];
  let heapGrowth = 0;
  let figures: ReturnType<typeof measurePulses> | null = null;
  for (let run = 0; run < RUNS; run += 1) {
    const before = process.memoryUsage();
    const t0 = performance.now();
    const capture = parseCaptureCsv(text);
    const t1 = performance.now();
    const results = capture.channels.map((c) => measurePulses({ timeS: capture.timeS, values: c.values }));
    const t2 = performance.now();
    for (const c of capture.channels) downsampleForPlot(capture.timeS, c.values, 2_000);
    const t3 = performance.now();
    const after = process.memoryUsage();
    heapGrowth = Math.max(heapGrowth, after.heapUsed + after.arrayBuffers - before.heapUsed - before.arrayBuffers);
    parse.push(t1 - t0);
    measure.push(t2 - t1);
    downsample.push(t3 - t2);
    figures = results[0] ?? null;
  }
  const parseMs = median(parse);
  const measureMs = median(measure);
  const result: WaveformFigures = {
    samples: SAMPLES,
    channels: 2,
    fileMegabytes: round(text.length / 1e6, 1),
    parseMs: round(parseMs, 0),
    measureMs: round(measureMs, 0),
    downsampleMs: round(median(downsample), 0),
    measureToParseRatio: round(measureMs / parseMs, 2),
    parseAndMeasureMs: round(parseMs + measureMs, 0),
    targetMs: 1000,
    heapGrowthMegabytes: round(heapGrowth / 1e6, 0),
    peakRssMegabytes: round(process.resourceUsage().maxRSS / 1024, 0),
    frequencyHz: figures?.frequencyHz ?? null,
    dutyCyclePct: figures?.dutyCyclePct ?? null,
  };
  console.log(
    [
      `waveform: ${SAMPLES.toLocaleString("en")} samples × 2 channels (${result.fileMegabytes} MB of CSV), median of ${RUNS} runs`,
      `  parse ${result.parseMs} ms · measure (both channels) ${result.measureMs} ms · measure/parse ${result.measureToParseRatio}`,
      `  parse + measure ${result.parseAndMeasureMs} ms (target: well under ${result.targetMs} ms) · LTTB to 2,000 points ${result.downsampleMs} ms`,
      `  memory: heap + array buffers grew by at most ${result.heapGrowthMegabytes} MB per run; peak RSS of the process ${result.peakRssMegabytes} MB (including the CSV text)`,
      `  measured: ${result.frequencyHz?.toFixed(1)} Hz, duty ${result.dutyCyclePct?.toFixed(2)} % (built as 20 kHz, 40 %)`,
    ].join("\n"),
  );
  return result;
}

/** Time in seconds with 9 significant digits and volts with 4 decimals, as instruments commonly write them. */
function buildCapture(samples: number): string {
  const sampleRate = 100e6;
  const period = 1 / 20e3;
  const rise = 100e-9 / 0.8;
  let seed = 12345;
  const noise = () => {
    seed = (seed * 1103515245 + 12345) & 0x7fffffff;
    return (seed / 0x7fffffff - 0.5) * 0.2;
  };
  const lines: string[] = ["Sample interval,1e-8", "", "Time (s),Gate (V),Sense (V)"];
  for (let i = 0; i < samples; i += 1) {
    const t = i / sampleRate;
    const p = (t + period / 3) % period;
    let v: number;
    if (p < rise) v = (12 * p) / rise;
    else if (p < 0.4 * period) v = 12;
    else if (p < 0.4 * period + rise) v = 12 - (12 * (p - 0.4 * period)) / rise;
    else v = 0;
    v += noise();
    lines.push(`${t.toPrecision(9)},${v.toFixed(4)},${(v / 2).toFixed(4)}`);
  }
  return lines.join("\n");
}

function median(xs: number[]): number {
  const sorted = [...xs].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  runWaveformBench().catch((error) => {
    console.error(error);
    process.exit(1);
  });
}
